#!/usr/bin/env node
/**
 * Compares two golden sets (scripts/golden-set.mjs): how many files are byte-identical, the
 * largest relative change of every numeric field (paths with array indices folded), and every
 * non-numeric difference: a string, a code, a verdict, an array length or a line of the text
 * summary. Exit code 1 when there is any non-numeric difference, or when an analysis of either set
 * threw (its record holds the error, so nothing of it could be compared).
 *
 *   node scripts/golden-compare.mjs BEFORE_FOLDER AFTER_FOLDER
 *   GOLDEN_PATH='text summary' node scripts/golden-compare.mjs ...   (list only differences whose path contains it)
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const [before, after] = process.argv.slice(2);
if (!before || !after) {
  console.error('usage: node scripts/golden-compare.mjs BEFORE_FOLDER AFTER_FOLDER');
  process.exit(2);
}
const largest = new Map();
const other = [];
let identical = 0;
const files = readdirSync(before).filter((f) => f.endsWith('.json'));

function walk(x, y, path, file) {
  if (typeof x === 'number' && typeof y === 'number') {
    if (x === y) return;
    const relative = Math.abs(x - y) / Math.max(Math.abs(x), Math.abs(y), 1e-300);
    const key = path.replace(/\[\d+\]/g, '[]');
    const seen = largest.get(key);
    if (!seen || relative > seen.relative) largest.set(key, { relative, file, x, y });
    return;
  }
  if (typeof x !== typeof y || x === null || y === null || typeof x !== 'object') {
    if (x !== y) other.push({ file, path, x: JSON.stringify(x), y: JSON.stringify(y) });
    return;
  }
  if (Array.isArray(x) && x.length !== y.length) {
    other.push({ file, path, x: `${x.length} entries`, y: `${y.length} entries` });
    return;
  }
  for (const k of new Set([...Object.keys(x), ...Object.keys(y)])) walk(x[k], y[k], Array.isArray(x) ? `${path}[${k}]` : `${path}.${k}`, file);
}

const failed = [];
for (const file of files) {
  const a = readFileSync(join(before, file), 'utf8');
  const b = readFileSync(join(after, file), 'utf8');
  // an analysis that threw compares nothing: it is a failure of the set, not an agreement
  for (const [side, text] of [['before', a], ['after', b]]) if ('error' in JSON.parse(text)) failed.push(`${side}/${file}`);
  if (a === b) {
    identical++;
    continue;
  }
  const x = JSON.parse(a);
  const y = JSON.parse(b);
  walk(x.json ?? x, y.json ?? y, '', file);
  const linesA = (x.text ?? '').split('\n');
  const linesB = (y.text ?? '').split('\n');
  for (let k = 0; k < Math.max(linesA.length, linesB.length); k++) {
    if (linesA[k] !== linesB[k]) other.push({ file, path: `text summary line ${k + 1}`, x: linesA[k], y: linesB[k] });
  }
}
console.log(`${identical} of ${files.length} files byte-identical`);
const fields = [...largest].sort((p, q) => q[1].relative - p[1].relative);
console.log(`numeric fields that changed: ${fields.length}`);
for (const [key, w] of fields) console.log(`  ${w.relative.toExponential(2)}  ${key}  (${w.file}: ${w.x} -> ${w.y})`);
console.log(`non-numeric differences: ${other.length}`);
const byPath = new Map();
for (const d of other) {
  const key = d.path.startsWith('text') ? 'text summary lines' : d.path.replace(/\[\d+\]/g, '[]');
  byPath.set(key, (byPath.get(key) ?? 0) + 1);
}
for (const [key, count] of [...byPath].sort((p, q) => q[1] - p[1])) console.log(`  ${count} x ${key}`);
for (const d of other.filter((o) => process.env.GOLDEN_PATH === undefined || o.path.includes(process.env.GOLDEN_PATH)).slice(0, 40)) console.log(`  ${d.file} ${d.path}\n    - ${d.x}\n    + ${d.y}`);
if (failed.length > 0) console.log(`analyses that threw (nothing compared): ${failed.length}\n  ${failed.slice(0, 10).join('\n  ')}`);
process.exit(other.length > 0 || failed.length > 0 ? 1 : 0);
