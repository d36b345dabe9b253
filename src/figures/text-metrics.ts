/**
 * Text sizes for layout without a renderer: nothing measures glyphs here, so margins, legends and
 * wrapped captions are laid out from an estimate of the advance width of each character in a
 * Helvetica/Arial-like sans-serif (Liberation Sans on Linux has the same metrics). The widths per
 * class of character are rounded up from the Arial advance widths (in em, from memory) and a 6%
 * margin is added, so the estimate errs on the wide side; the browser test checks the result
 * against real glyph boxes.
 */

/** Font stack of every figure: metric-compatible faces first. */
export const FONT_FAMILY = "'Liberation Sans', Arial, Helvetica, sans-serif";

/** Font sizes in pt (user units are pt at print size; nothing below 8 pt). */
export const FONT = {
  tick: 8,
  axisTitle: 8.5,
  panelTitle: 8,
  legend: 8,
  note: 8,
  figureTitle: 9,
} as const;

const NARROW = new Set(Array.from("iljt.,:;'|!()[]/ f-r1I"));
const WIDE = new Set(Array.from('mwMW@%'));

const emCache = new Map<string, number>();

function charEm(ch: string): number {
  let em = emCache.get(ch);
  if (em === undefined) {
    em = charEmOf(ch);
    emCache.set(ch, em);
  }
  return em;
}

function charEmOf(ch: string): number {
  if (NARROW.has(ch)) return 0.34;
  if (WIDE.has(ch)) return 0.89;
  if (/[0-9]/.test(ch)) return 0.56;
  if (/[A-Z]/.test(ch)) return 0.7;
  if (ch === 'µ' || ch === '·' || ch === '⁻' || ch === '¹') return 0.58;
  if (ch === 'Δ' || ch === 'τ' || ch === 'α') return 0.68;
  return 0.56;
}

/** Estimated advance width of `text` at `fontSize` pt. */
export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const ch of text) em += charEm(ch);
  return em * fontSize * 1.06;
}

/** Splits `text` into lines no wider than `width` at `fontSize` (words are never broken). */
export function wrapText(text: string, width: number, fontSize: number): string[] {
  const words = text.split(/\s+/).filter((w) => w.length > 0);
  const lines: string[] = [];
  let line = '';
  // the line's width in em, summed character by character as textWidth sums it (so the same
  // number), carried on from word to word instead of re-summed for every candidate line
  let lineEm = 0;
  for (const word of words) {
    let nextEm = line ? lineEm + charEm(' ') : 0;
    for (const ch of word) nextEm += charEm(ch);
    if (line && nextEm * fontSize * 1.06 > width) {
      lines.push(line);
      line = word;
      lineEm = 0;
      for (const ch of word) lineEm += charEm(ch);
    } else {
      line = line ? `${line} ${word}` : word;
      lineEm = nextEm;
    }
  }
  if (line) lines.push(line);
  return lines;
}
