/** A plain HTML table from already-escaped cell markup. */

export interface Cell {
  html: string;
  /** right-align numbers */
  num?: boolean;
  className?: string;
}

export function cell(html: string, num = false, className?: string): Cell {
  return { html, num, ...(className ? { className } : {}) };
}

export function htmlTable(headers: readonly Cell[], rows: readonly Cell[][], className = 'data'): string {
  const td = (c: Cell, tag: 'td' | 'th') => {
    const classes = [c.num ? 'num' : '', c.className ?? ''].filter(Boolean).join(' ');
    return `<${tag}${classes ? ` class="${classes}"` : ''}>${c.html}</${tag}>`;
  };
  const head = `<thead><tr>${headers.map((h) => td(h, 'th')).join('')}</tr></thead>`;
  const body = `<tbody>${rows.map((r) => `<tr>${r.map((c) => td(c, 'td')).join('')}</tr>`).join('\n')}</tbody>`;
  return `<div class="table-wrap"><table class="${className}">${head}\n${body}</table></div>`;
}
