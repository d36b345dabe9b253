/** Escaping of text placed in HTML (element content and quoted attribute values). */

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes &, <, >, " and ' so any text is safe inside an element or a quoted attribute. */
export function escapeHtml(text: string | number): string {
  const s = String(text);
  // most text holds none of them: no replacement pass then (the same string either way)
  return /[&<>"']/.test(s) ? s.replace(/[&<>"']/g, (c) => ENTITIES[c]) : s;
}
