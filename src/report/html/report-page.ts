/**
 * The report page: one self-contained HTML file (inline CSS and SVG, no script, no external
 * fetch). Order: verdict beside the primary plot, the constants, the quantities derived from them,
 * the fit and its residuals, the checks on the fit, the comparison of mechanisms, warnings,
 * uncertainty, replots, data, methods, cautions, footer.
 */
import type { AnalysisResult } from '../../analysis/types.js';
import type { FigureOutput } from '../../figures/figure-output.js';
import { escapeHtml } from './escape.js';
import { REPORT_CSS } from './report-css.js';
import { pageHead } from './page-head.js';
import type { ReportProvenance } from './provenance.js';
import { verdictSection } from './sections/verdict-section.js';
import { parametersSection } from './sections/parameters-section.js';
import { comparisonSection } from './sections/comparison-section.js';
import { warningsSection } from './sections/warnings-section.js';
import { dataSection } from './sections/data-section.js';
import { methodsSection } from './sections/methods-section.js';
import { cautionsSection } from './sections/cautions-section.js';
import { provenanceFooter } from './sections/provenance-footer.js';
import { figureBlock } from './sections/figure-block.js';
import { derivedSection } from './sections/derived-section.js';
import { fitChecksSection } from './sections/fit-checks-section.js';

interface ReportInput {
  result: AnalysisResult;
  figures: readonly FigureOutput[];
  provenance?: ReportProvenance;
}

function byId(figures: readonly FigureOutput[], id: string): FigureOutput | undefined {
  return figures.find((f) => f.id === id);
}

function grid(figures: readonly FigureOutput[]): string {
  return `<div class="figure-grid">\n${figures.map((f) => figureBlock(f)).join('\n')}\n</div>`;
}

export function reportHtml(input: ReportInput): string {
  const { result, figures } = input;
  const primary = byId(figures, 'fig-rate-curves');
  const evidence = byId(figures, 'fig-evidence');
  const fitFigures = figures.filter((f) => f.group === 'fit' && f !== primary);
  const uncertainty = figures.filter((f) => f.group === 'uncertainty');
  const replots = figures.filter((f) => f.group === 'replot');
  const derived = derivedSection(result);
  const name = result.input.compound !== undefined ? `compound ${result.input.compound}` : result.input.source;
  const sections: Array<[string, string]> = [
    ['verdict', 'Verdict'],
    ['constants', 'Constants'],
    ...(derived ? ([['derived', 'Derived']] as Array<[string, string]>) : []),
    ['fit', 'Fit and residuals'],
    ['checks', 'Checks'],
    ['comparison', 'Mechanisms compared'],
    ['warnings', 'Warnings'],
    ...(uncertainty.length ? ([['uncertainty', 'Uncertainty']] as Array<[string, string]>) : []),
    ['replots', 'Replots'],
    ['data', 'Data'],
    ['methods', 'Methods'],
    ['cautions', 'Cautions'],
    ['provenance', 'Reproducibility'],
  ];
  const nav = `<nav class="contents" aria-label="Contents">${sections.map(([id, label]) => `<a href="#${id}">${escapeHtml(label)}</a>`).join('')}</nav>`;
  return `${pageHead(`Inhibition mechanism report: ${name}`, REPORT_CSS)}
<body>
<header class="page">
<h1>Inhibition mechanism report</h1>
<p class="source">${escapeHtml(`${result.input.source}${result.input.compound !== undefined ? ` · compound ${result.input.compound}` : ''} · ${result.input.rowsUsed} rates · error model: ${result.errorModel}`)}</p>
${nav}
</header>
<main>
<div class="opening">
${verdictSection(result)}
${primary ? figureBlock(primary, 'primary') : ''}
</div>
${parametersSection(result)}
${derived}
<section id="fit">
<h2>Fit and residuals</h2>
${grid(fitFigures)}
</section>
${fitChecksSection(result)}
${comparisonSection(result, evidence ? figureBlock(evidence) : '')}
${warningsSection(result)}
${uncertainty.length ? `<section id="uncertainty">\n<h2>Uncertainty</h2>\n${grid(uncertainty)}\n</section>` : ''}
<section id="replots">
<h2>Replots</h2>
<p class="replot-note"><strong>Qualitative.</strong> These plots are for the eye: each shows the measured points transformed and the global fit transformed the same way. No constant in this report is read off them, and no line is fitted to the transformed points, whose errors the transformation distorts.</p>
${replots.length ? grid(replots) : '<p>No replots could be drawn.</p>'}
</section>
${dataSection(result)}
${methodsSection(result)}
${cautionsSection(result)}
</main>
${provenanceFooter(result, input.provenance)}
</body>
</html>
`;
}
