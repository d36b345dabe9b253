/**
 * "What would settle it" once per piece of advice: several caveats can carry the same suggestion
 * (or the same one worded with other spacing or case); the report and the text summary list each
 * once, in first-seen order. A suggestion that a reason already states word for word is dropped too.
 */
const key = (s: string) => s.toLowerCase().replace(/[\s.;,:]+/g, ' ').trim();

export function distinctAdvice(suggestions: readonly string[], reasons: readonly string[] = []): string[] {
  const seen = new Set(reasons.map(key));
  const out: string[] = [];
  for (const s of suggestions) {
    const k = key(s);
    if (seen.has(k)) continue;
    seen.add(k);
    out.push(s);
  }
  return out;
}
