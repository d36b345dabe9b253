/** Paths inside the installed package (shipped demo data), independent of the working folder. */
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

/** The package root: dist/cli/ (or src/cli/ under the test runner) is two levels below it. */
export function packageRoot(): string {
  return join(dirname(fileURLToPath(import.meta.url)), '..', '..');
}

export function demoDataPath(): string {
  return join(packageRoot(), 'data', 'demo', 'hlx-amidase-kt0417.csv');
}
