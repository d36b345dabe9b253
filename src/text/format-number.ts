/** Number formatting: significant digits, p values and intervals as text. Imports nothing, so every layer may use it (docs/decisions/layer-rule.md). */

/** A number to `digits` significant digits, without exponent clutter for everyday magnitudes. */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-4 && a < 1e6) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1).replace('e+', 'e');
}

/** A p value in the usual style: "< 0.001" or three decimals. */
export function pValue(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return '–';
  return p < 0.001 ? '< 0.001' : p.toFixed(3);
}

/** A p value as a phrase: "p < 0.001" or "p = 0.123". */
export function pPhrase(p: number | null | undefined): string {
  const text = pValue(p);
  return text.startsWith('<') ? `p ${text}` : text === '–' ? 'p not available' : `p = ${text}`;
}

/** An interval as "[lo, hi]"; an open end shows as "…" with the side named by the caller. */
export function interval(lo: number | null | undefined, hi: number | null | undefined, digits = 4): string {
  const a = lo === null || lo === undefined ? '…' : sig(lo, digits);
  const b = hi === null || hi === undefined ? '…' : sig(hi, digits);
  return `[${a}, ${b}]`;
}

/** A number rounded to `digits` significant digits and printed as JavaScript prints it (1e-7 stays "1e-7"). */
export function rounded(x: number, digits: number): string {
  return String(Number(x.toPrecision(digits)));
}

/** `200 nM`, or `200` when the unit is not known: a value as a message prints it. */
export function valueWithUnit(text: string, unit: string | null | undefined): string {
  return unit ? `${text} ${unit}` : text;
}
