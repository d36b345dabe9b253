/**
 * Output of a single-[S] (dose-response) analysis: the JSON document (`analyze --json`,
 * results.json) and the text summary. The JSON contract (README, "Single-[S] tables"):
 *   doseResponse: { model, ic50: { value, unit, ci95, interval, wald95 }, hill: { value, ci95, from },
 *                   substrate: { value, unit }, models: [...], kiByMechanism (with --km), notes }
 * Interval keys are named for the level (ci95 at 0.95, ci99 at 0.99). Non-finite numbers are null.
 */
import type { SingleSubstrateResult } from '../analysis/single-substrate.js';
import type { DoseResponseModelResult, Interval } from '../evidence/constants/dose-response.js';
import { describeTable } from '../input/describe-table.js';
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import { interval, sig, valueWithUnit } from '../text/format-number.js';
import { jsonNumber, type Json } from './json-values.js';
import { levelKey } from './results-json.js';

const pair = (x: Interval | null): Json => (x === null ? null : [jsonNumber(x[0]), jsonNumber(x[1])]);

/** The profile interval when it has an end, else Wald; and which one it is. */
function bestInterval(q: { profile: Interval; wald: Interval }): { ends: Interval; kind: 'profile' | 'wald' } {
  return q.profile[0] !== null || q.profile[1] !== null ? { ends: q.profile, kind: 'profile' } : { ends: q.wald, kind: 'wald' };
}

function modelJson(m: DoseResponseModelResult, level: number, unit: string | null): { [key: string]: Json } {
  const ci = levelKey('ci', level);
  const ic50 = bestInterval(m.ic50);
  const hill = m.hill ? bestInterval(m.hill) : null;
  return {
    model: m.model,
    label: m.label,
    converged: m.converged,
    n: m.n,
    nParams: m.p,
    sse: jsonNumber(m.sse),
    aicc: jsonNumber(m.aicc),
    params: Object.fromEntries(Object.entries(m.params).map(([k, v]) => [k, jsonNumber(v)])),
    ic50: { value: jsonNumber(m.ic50.value), unit, [ci]: pair(ic50.ends), interval: ic50.kind, [levelKey('wald', level)]: pair(m.ic50.wald) },
    hill: m.hill ? { value: jsonNumber(m.hill.value), [ci]: pair(hill!.ends), interval: hill!.kind } : { value: 1, [ci]: null, fixed: true },
  };
}

export function doseResponseJson(result: SingleSubstrateResult): { [key: string]: Json } {
  const e = result.evidence;
  const table = result.table;
  const ci = levelKey('ci', result.level);
  const chosen = e.models.find((m) => m.model === e.chosen)!;
  const chosenJson = modelJson(chosen, result.level, result.units.inhibitor);
  // the Hill slope is estimated by the 4PL only (the hyperbola fixes it at 1): report that estimate
  const four = e.models.find((m) => m.model === 'four-parameter-logistic');
  const hill = four ? { ...(modelJson(four, result.level, null).hill as { [key: string]: Json }), from: four.model } : chosenJson.hill;
  const doseResponse: { [key: string]: Json } = {
    model: e.chosen,
    ic50: chosenJson.ic50,
    hill,
    substrate: { value: jsonNumber(result.substrate), unit: result.units.substrate },
    models: e.models.map((m) => modelJson(m, result.level, result.units.inhibitor)),
    notes: e.notes,
  };
  if (e.kiByMechanism) {
    doseResponse.km = { value: jsonNumber(e.km), unit: result.units.substrate };
    doseResponse.kiByMechanism = Object.fromEntries(
      Object.entries(e.kiByMechanism).map(([mechanism, k]) => [
        mechanism,
        { constant: k.constant, value: jsonNumber(k.value), unit: k.value === null ? null : result.units.inhibitor, [ci]: pair(k.interval), relation: k.relation },
      ]),
    );
  }
  return {
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    input: {
      source: table.source,
      ...(table.compound !== undefined ? { compound: table.compound } : {}),
      rowsRead: table.rowsRead,
      rowsUsed: table.points.length,
      excluded: table.excluded.map((x) => ({ line: x.line, ...(x.column !== undefined ? { column: x.column } : {}), reason: x.reason })),
      units: { substrate: table.units.substrate, inhibitor: table.units.inhibitor, rate: table.units.rate },
      warnings: table.warnings.map((w) => ({ code: w.code, message: w.message })),
    },
    design: 'single-substrate',
    errorModel: 'constant',
    level: result.level,
    doseResponse,
    verdict: {
      mechanism: null,
      outcome: 'single-substrate',
      decisive: false,
      headline: 'One [S] level: an IC50 curve, which cannot tell the mechanism.',
    },
  };
}

function withUnit(x: number | null, unit: string | null): string {
  return valueWithUnit(sig(x), unit);
}

function intervalText(ends: Interval, unit: string | null): string {
  const [lo, hi] = ends;
  const u = unit ? ` ${unit}` : '';
  if (lo !== null && hi !== null) return `${interval(lo, hi)}${u}`;
  if (lo !== null) return `above ${sig(lo)}${u} (open upper end)`;
  if (hi !== null) return `below ${sig(hi)}${u} (open lower end)`;
  return 'not bounded by these data';
}

export function doseResponseText(result: SingleSubstrateResult): string {
  const e = result.evidence;
  const u = result.units;
  const pct = `${Math.round(result.level * 100)}%`;
  const lines: string[] = [];
  lines.push(result.table.detection ? describeTable(result.table) : `${result.table.source}: ${result.table.rowsRead} read, ${result.table.points.length} used`);
  lines.push(`One [S] level (${withUnit(result.substrate, u.substrate)}): fitted as a dose-response (IC50) curve, constant error model; intervals at ${pct}`);
  lines.push('');
  lines.push('Verdict: one [S] level cannot tell the mechanism.');
  for (const n of e.notes) lines.push(`  - ${n}`);
  lines.push('');
  lines.push('Curve models, ranked by AICc:');
  e.models.forEach((m, k) => lines.push(`  ${k + 1}  ${m.label}: AICc ${sig(m.aicc, 6)}, SSE ${sig(m.sse, 5)}${m.converged ? '' : ' (did NOT converge)'}`));
  lines.push('');
  const chosen = e.models.find((m) => m.model === e.chosen)!;
  const ic50 = bestInterval(chosen.ic50);
  lines.push(`IC50 (${chosen.label}): ${withUnit(chosen.ic50.value, u.inhibitor)}  ${ic50.kind} ${pct} ${intervalText(ic50.ends, u.inhibitor)}`);
  if (chosen.hill) {
    const h = bestInterval(chosen.hill);
    lines.push(`Hill slope: ${sig(chosen.hill.value)}  ${h.kind} ${pct} ${intervalText(h.ends, null)}`);
  } else {
    const four = e.models.find((m) => m.hill !== null);
    const h = four?.hill ? bestInterval(four.hill) : null;
    lines.push(`Hill slope: 1 (fixed by the single-site model)${four?.hill && h ? `; the four-parameter fit estimates ${sig(four.hill.value)}, ${h.kind} ${pct} ${intervalText(h.ends, null)}` : ''}`);
  }
  for (const m of e.models) if (m !== chosen) lines.push(`  (${m.label}: IC50 ${withUnit(m.ic50.value, u.inhibitor)})`);
  if (e.kiByMechanism) {
    lines.push('');
    lines.push(`Ki each mechanism would imply at [S] = ${withUnit(result.substrate, u.substrate)}, Km = ${withUnit(e.km, u.substrate)} (Cheng-Prusoff):`);
    for (const [mechanism, k] of Object.entries(e.kiByMechanism)) {
      lines.push(
        k.value === null
          ? `  ${mechanism}: not determined (${k.relation})`
          : `  ${mechanism}: ${k.constant} = ${withUnit(k.value, u.inhibitor)}  ${pct} ${intervalText(k.interval!, u.inhibitor)}   [${k.relation}]`,
      );
    }
  }
  if (result.table.excluded.length) {
    lines.push('');
    lines.push(`Excluded rows (${result.table.excluded.length}):`);
    for (const x of result.table.excluded) lines.push(`  line ${x.line}: ${x.reason}`);
  }
  if (result.table.warnings.length) {
    lines.push('');
    lines.push('Warnings:');
    for (const w of result.table.warnings) lines.push(`  ! ${w.message}`);
  }
  lines.push('');
  lines.push('Research use only: an IC50 depends on the assay [S]; compare compounds at the same [S], or as Ki under a stated mechanism.');
  return lines.join('\n') + '\n';
}

/** The files of a one-[S] result folder: results.json and summary.txt (no figures yet). */
export function doseResponseFiles(result: SingleSubstrateResult): Array<[string, string]> {
  return [
    ['results.json', JSON.stringify(doseResponseJson(result), null, 2) + '\n'],
    ['summary.txt', doseResponseText(result)],
  ];
}
