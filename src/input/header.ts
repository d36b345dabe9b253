/**
 * Header cells: a column name with an optional unit in brackets or parentheses,
 * e.g. `substrate (uM)`, `Inhibitor [nM]`, `rate (uM/min)`.
 */

interface HeaderName {
  /** the name as written, without the unit and surrounding spaces */
  name: string;
  /** lower-case name, used to recognise columns and to find duplicates */
  key: string;
  /** the unit text inside the brackets, or null */
  unit: string | null;
}

const NAME_WITH_UNIT = /^(.*?)\s*[([]\s*([^()[\]]*?)\s*[)\]]\s*$/;

export function splitHeaderName(cell: string): HeaderName {
  const text = cell.trim();
  const match = NAME_WITH_UNIT.exec(text);
  if (match && match[1] !== '') {
    const name = match[1].trim();
    return { name, key: name.toLowerCase(), unit: match[2] === '' ? null : match[2] };
  }
  return { name: text, key: text.toLowerCase(), unit: null };
}
