#!/usr/bin/env python3
"""Batch throughput of scipy on the compounds of bench/batch-bench.mjs: all five mechanisms fitted
to every compound, one compound after another in one process, with the committed reference runner
test/fixtures/scipy-fit/runner.py (scipy.optimize.least_squares on log parameters; its `fit_all`).

  python3 bench/scipy-batch-runner.py DATASETS.json [LIMIT]

DATASETS.json: {"datasets": [{"name": ..., "s": [...], "i": [...], "v": [...]}, ...]} (written by
batch-bench.mjs). Prints one JSON line: compounds fitted, wall and CPU seconds, compounds per
second, for the runner's lean configuration ('lm' from a few starts, warm-started mixed: the
counterpart of a batch engine) and, on the first tenth, its thorough one ('trf' and 'lm' from a
start grid). Error model: constant (the batch default).
"""
import importlib.util
import json
import os
import sys
import time

HERE = os.path.dirname(os.path.abspath(__file__))
RUNNER = os.path.join(HERE, "..", "test", "fixtures", "scipy-fit", "runner.py")


def load_runner():
    spec = importlib.util.spec_from_file_location("scipy_fit_runner", RUNNER)
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def timed(fn, datasets):
    wall0, cpu0 = time.perf_counter(), time.process_time()
    for ds in datasets:
        fn(ds)
    wall, cpu = time.perf_counter() - wall0, time.process_time() - cpu0
    return {"compounds": len(datasets), "wallSeconds": wall, "cpuSeconds": cpu, "compoundsPerSecond": len(datasets) / wall}


def main():
    path = sys.argv[1]
    limit = int(sys.argv[2]) if len(sys.argv) > 2 else None
    with open(path) as fh:
        datasets = json.load(fh)["datasets"]
    if limit is not None:
        datasets = datasets[:limit]
    runner = load_runner()
    runner.fit_all(datasets[0], "constant", False)  # warm-up (imports, first calls)
    lean = timed(lambda ds: runner.fit_all(ds, "constant", False), datasets)
    thorough = timed(lambda ds: runner.fit_all(ds, "constant", True), datasets[: max(1, len(datasets) // 10)])
    import numpy
    import scipy
    print(json.dumps({"scipy": scipy.__version__, "numpy": numpy.__version__, "lean": lean, "thorough": thorough}))


if __name__ == "__main__":
    main()
