/**
 * DEVELOPERS.md, "The model contract": its checklist names the fields of `MechanismModel`
 * (src/models/types.ts). Fails when an item names a field the contract no longer has, when the
 * contract has a field the checklist omits, or when a name quoted in a field item (a rule kind, a
 * capability) no longer occurs in the contract's source. The registered models are checked against
 * the required fields at run time.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { registeredModels } from '../../src/models/registry.js';

const guide = readFileSync(new URL('../../DEVELOPERS.md', import.meta.url), 'utf8');
const typesSource = readFileSync(new URL('../../src/models/types.ts', import.meta.url), 'utf8');

/** Member names of `export interface <name> { ... }` in the source, with whether they are optional. */
function interfaceMembers(source: string, name: string): Map<string, { optional: boolean }> {
  const start = source.indexOf(`export interface ${name} {`);
  if (start < 0) throw new Error(`interface ${name} not found in src/models/types.ts`);
  let depth = 0;
  let end = start;
  for (let k = source.indexOf('{', start); k < source.length; k++) {
    if (source[k] === '{') depth++;
    if (source[k] === '}' && --depth === 0) {
      end = k;
      break;
    }
  }
  const body = source.slice(source.indexOf('{', start) + 1, end).replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
  const members = new Map<string, { optional: boolean }>();
  for (const line of body.split('\n')) {
    const m = /^\s{2}(?:readonly\s+)?([A-Za-z_]\w*)(\?)?\s*[:(]/.exec(line);
    if (m) members.set(m[1], { optional: m[2] === '?' });
  }
  return members;
}

/** The checklist items of the section, each joined onto one line. */
function checklistItems(): string[] {
  const section = guide.split(/^## /m).find((s) => s.startsWith('The model contract'));
  if (!section) throw new Error('DEVELOPERS.md has no section "The model contract"');
  const items: string[] = [];
  for (const line of section.split('\n')) {
    if (line.startsWith('- [ ] ')) items.push(line.slice(6).trim());
    else if (/^\s+\S/.test(line) && items.length > 0) items[items.length - 1] += ' ' + line.trim();
  }
  return items;
}

const contract = interfaceMembers(typesSource, 'MechanismModel');
const items = checklistItems();
/** items that start with a quoted name describe fields: the quoted names before the first colon */
const fieldItems = items.filter((item) => item.startsWith('`'));
const namedFields = fieldItems.flatMap((item) => [...item.slice(0, item.indexOf(':')).matchAll(/`([A-Za-z_]\w*)`/g)].map((m) => m[1]));

describe('DEVELOPERS.md model checklist and the MechanismModel contract', () => {
  it('finds the contract and the checklist', () => {
    expect(contract.size).toBeGreaterThanOrEqual(7);
    expect(fieldItems.length).toBeGreaterThanOrEqual(7);
  });

  it('names only fields the contract has', () => {
    const unknown = namedFields.filter((name) => !contract.has(name));
    expect(unknown, `checklist names fields MechanismModel does not have: ${unknown.join(', ')}`).toEqual([]);
  });

  it('names every field of the contract', () => {
    const missing = [...contract.keys()].filter((name) => !namedFields.includes(name));
    expect(missing, `MechanismModel fields missing from the checklist: ${missing.join(', ')}`).toEqual([]);
  });

  it('quotes in the field items only names that occur in src/models/types.ts', () => {
    const quoted = fieldItems.flatMap((item) => [...item.matchAll(/`([A-Za-z_]\w*)`/g)].map((m) => m[1]));
    const absent = quoted.filter((name) => !new RegExp(`\\b${name}\\b`).test(typesSource));
    expect(absent).toEqual([]);
  });

  it('every registered model has the required fields of the contract', () => {
    const required = [...contract].filter(([, v]) => !v.optional).map(([k]) => k);
    expect(required).toEqual(expect.arrayContaining(['rate', 'gradLog', 'starts', 'params']));
    for (const model of registeredModels()) {
      for (const name of required) expect(model, `${model.label}: ${name}`).toHaveProperty(name);
      expect(typeof model.rate).toBe('function');
      expect(typeof model.gradLog).toBe('function');
      expect(typeof model.starts).toBe('function');
      if (model.specs) expect(model.specs.map((s) => s.name)).toEqual([...model.params]);
    }
  });
});
