/** The opening of a standalone HTML page of mechanist (report, plan): doctype, head with the generator, title and style. */
import { TOOL_NAME, TOOL_VERSION } from '../../version.js';
import { escapeHtml } from './escape.js';

/** `<!DOCTYPE html>` through `</head>`; `title` is escaped here, `css` goes into the style element as it is. */
export function pageHead(title: string, css: string): string {
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${escapeHtml(`${TOOL_NAME} ${TOOL_VERSION}`)}">
<title>${escapeHtml(title)}</title>
<style>${css}</style>
</head>`;
}
