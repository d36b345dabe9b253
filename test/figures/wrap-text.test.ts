/**
 * wrapText (src/figures/text-metrics.ts) carries each line's width from word to word instead of
 * measuring every candidate line again; the lines must be exactly those of measuring each
 * candidate with textWidth (the former rule), so no figure's layout moves.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { textWidth, wrapText } from '../../src/figures/text-metrics.js';

function measuredEachTime(text: string, width: number, fontSize: number): string[] {
  const words = text.split(/\s+/).filter((w) => w.length > 0);
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if (line && textWidth(next, fontSize) > width) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

describe('wrapText', () => {
  it('breaks a caption as measuring every candidate line does', () => {
    const caption = 'Lines: the global mixed fit redrawn in these coordinates, not a fit to these points. Lines meet at [I] = -618 µM, [S]/v = -5.53 s·nM⁻¹ (outside the drawn range).';
    for (const width of [40, 120, 231, 400]) expect(wrapText(caption, width, 8)).toEqual(measuredEachTime(caption, width, 8));
    expect(wrapText(caption, 120, 8).length).toBeGreaterThan(3);
  });

  it('agrees on arbitrary text, widths and sizes', () => {
    const word = fc.stringMatching(/^[a-zA-Z0-9µ·⁻¹Δτα.,:;()[\]@%mw-]{1,14}$/);
    fc.assert(
      fc.property(fc.array(word, { maxLength: 40 }), fc.double({ min: 1, max: 500, noNaN: true }), fc.constantFrom(7, 8, 8.5, 9), (words, width, size) => {
        const text = words.join(' ');
        expect(wrapText(text, width, size)).toEqual(measuredEachTime(text, width, size));
      }),
      { numRuns: 300 },
    );
  });
});
