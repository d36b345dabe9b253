/** The page's stylesheet, inlined into every report (no external fetch). This project's own design. */
export const REPORT_CSS = `
:root {
  --ink: #1f2328; --muted: #5d6670; --rule: #d8dde2; --panel: #f6f7f9; --accent: #1d3782;
  --firm: #0a7d5a; --open: #a8660c; --none: #5a6570;
  font-family: "Liberation Sans", Arial, Helvetica, sans-serif; color: var(--ink); line-height: 1.45;
}
* { box-sizing: border-box; }
body { margin: 0; background: #ffffff; font-size: 15px; }
main { max-width: 1120px; margin: 0 auto; padding: 0 24px 40px; }
header.page { border-bottom: 3px solid var(--accent); padding: 18px 24px 12px; max-width: 1120px; margin: 0 auto; }
header.page h1 { margin: 0; font-size: 22px; letter-spacing: 0.01em; }
header.page .source { margin: 4px 0 0; color: var(--muted); font-size: 14px; }
nav.contents { font-size: 13px; margin: 10px 0 0; }
nav.contents a { color: var(--accent); text-decoration: none; margin-right: 14px; white-space: nowrap; }
nav.contents a:hover { text-decoration: underline; }
h2 { font-size: 19px; margin: 34px 0 10px; padding-bottom: 4px; border-bottom: 1px solid var(--rule); }
h3 { font-size: 15px; margin: 18px 0 6px; }
h4 { font-size: 14px; margin: 14px 0 4px; }
.muted { color: var(--muted); font-weight: normal; }
.lead { max-width: 70ch; }
code { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 0.86em; }
.opening { display: grid; grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); gap: 28px; align-items: start; margin-top: 22px; }
@media (max-width: 860px) { .opening { grid-template-columns: 1fr; } }
section.verdict { border-left: 6px solid var(--firm); background: var(--panel); padding: 14px 18px 10px; border-radius: 3px; }
section.verdict.outcome-undecided { border-left-color: var(--open); }
section.verdict.outcome-no-inhibition { border-left-color: var(--none); }
.verdict-tag { margin: 0; font-size: 12px; text-transform: uppercase; letter-spacing: 0.08em; font-weight: bold; color: var(--firm); }
.outcome-undecided .verdict-tag { color: var(--open); }
.outcome-no-inhibition .verdict-tag { color: var(--none); }
.verdict h2.headline { border: 0; margin: 4px 0 10px; font-size: 21px; padding: 0; }
.verdict h3 { font-size: 14px; margin: 12px 0 4px; }
.verdict ul { margin: 0; padding-left: 20px; }
.verdict li { margin: 2px 0; }
ul.key-constants { list-style: none; padding: 0; margin: 0 0 6px; display: flex; flex-wrap: wrap; gap: 6px 10px; }
ul.key-constants li { background: #ffffff; border: 1px solid var(--rule); border-radius: 3px; padding: 4px 9px; font-size: 14px; }
.key-name { font-weight: bold; }
.key-range, .key-note { color: var(--muted); font-size: 13px; }
figure.plot { margin: 0; }
figure.plot svg { display: block; width: 100%; height: auto; max-width: 520px; }
figure.plot figcaption { font-size: 13px; color: var(--muted); margin-top: 4px; max-width: 520px; }
a.svg-link { color: var(--accent); font-size: 12px; margin-left: 4px; }
.figure-grid { display: grid; grid-template-columns: repeat(auto-fill, minmax(400px, 1fr)); gap: 26px 28px; align-items: start; }
.side-by-side { display: grid; grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); gap: 28px; align-items: start; }
@media (max-width: 860px) { .side-by-side { grid-template-columns: 1fr; } }
.table-wrap { overflow-x: auto; margin: 6px 0 10px; }
table { border-collapse: collapse; font-size: 13.5px; font-variant-numeric: tabular-nums; }
th, td { padding: 4px 9px; border-bottom: 1px solid var(--rule); text-align: left; vertical-align: top; }
th { background: var(--panel); font-weight: bold; border-bottom: 1px solid #b9c0c7; }
td.num, th.num { text-align: right; white-space: nowrap; }
td.undetected { color: var(--open); font-style: italic; }
td.excluded-row { color: var(--open); }
td.num.as-written { white-space: normal; overflow-wrap: anywhere; max-width: 18ch; }
td.warn { color: var(--open); font-weight: bold; }
p.formula { max-width: 85ch; }
p.formula code { white-space: normal; overflow-wrap: anywhere; }
.warn { color: var(--open); }
ul.warnings li { margin: 4px 0; }
ul.warnings .code { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 12px; background: #fff3dc; color: #6b4300; padding: 1px 5px; border-radius: 2px; margin-right: 4px; }
details { margin: 8px 0; }
details > summary { cursor: pointer; color: var(--accent); font-weight: bold; font-size: 14px; }
.replot-note { background: #fff7e0; border: 1px solid #e5c77a; border-radius: 3px; padding: 8px 12px; max-width: 80ch; }
ul.cautions li { margin: 5px 0; max-width: 85ch; }
ol.references { font-size: 13px; color: var(--muted); }
ol.references li { margin: 2px 0; }
footer#provenance { max-width: 1120px; margin: 30px auto 0; padding: 0 24px 30px; font-size: 13px; color: var(--muted); }
footer#provenance h2 { font-size: 15px; color: var(--ink); }
footer#provenance dl { display: grid; grid-template-columns: max-content minmax(0, 1fr); gap: 2px 16px; margin: 0; }
footer#provenance dt { font-weight: bold; color: var(--ink); }
footer#provenance dd { margin: 0; overflow-wrap: anywhere; }
@media print {
  body { font-size: 11pt; }
  nav.contents, a.svg-link { display: none; }
  details { display: block; }
  figure.plot { break-inside: avoid; }
  section.verdict { break-inside: avoid; }
}
`;
