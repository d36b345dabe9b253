/**
 * The plan page (plan.html): one self-contained file in the style of the analysis report (the same
 * CSS, inline SVG, no script): the recommendation, the figures, the candidates side by side, the
 * assumptions and cautions, the methods with their sources, and the settings.
 */
import { REPORT_CSS } from '../report/html/report-css.js';
import { pageHead } from '../report/html/page-head.js';
import { escapeHtml } from '../report/html/escape.js';
import { cell, htmlTable } from '../report/html/html-table.js';
import { figureBlock } from '../report/html/sections/figure-block.js';
import type { FigureOutput } from '../figures/figure-output.js';
import { TOOL_NAME, TOOL_VERSION } from '../version.js';
import type { PlanResult } from './plan-experiment.js';
import { gridTable } from './plan-text.js';
import { modelFor } from '../models/index.js';

const pct = (x: number | null | undefined) => (x === null || x === undefined ? '–' : `${Math.round(100 * x)}%`);
const fold = (x: number | null | undefined) => (x === null || x === undefined || !Number.isFinite(x) ? 'open' : `${x.toFixed(2)}×`);

function candidatesTable(plan: PlanResult): string {
  const rows = plan.candidates
    .filter((c) => c.role !== 'ds-optimum')
    .flatMap((c) =>
      plan.request.mechanisms.map((m, k) => {
        const p = c.predicted?.[m];
        const e = c.expected[m];
        const has = (name: 'Ki' | 'Kiu') => modelFor(m).params.includes(name);
        return [
          cell(k === 0 ? `<strong>${escapeHtml(c.name)}</strong><br>${escapeHtml(`${c.wellCount} wells`)}` : ''),
          cell(escapeHtml(m)),
          cell(pct(p?.decisiveCorrect), true),
          cell(pct(p?.decisiveWrong), true),
          cell(has('Ki') && p ? escapeHtml(fold(p.kiFoldWidth)) : '–', true),
          cell(has('Kiu') && p ? escapeHtml(fold(p.kiuFoldWidth)) : '–', true),
          cell(has('Ki') || has('Kiu') ? escapeHtml(fold(e?.kiFoldWidth ?? e?.kiuFoldWidth)) : '–', true),
        ];
      }),
    );
  return htmlTable(
    ['design', 'true mechanism', 'firm, correct', 'firm, wrong', 'Ki fold (sim.)', 'Kiu fold (sim.)', 'Ki/Kiu fold (info.)'].map((h) => cell(escapeHtml(h))),
    rows,
  );
}

function recommendedTable(plan: PlanResult): string {
  const lines = gridTable(plan.recommended.points, plan.request.units);
  return `<pre class="grid">${escapeHtml(lines.join('\n'))}</pre>`;
}

export function planPage(plan: PlanResult, figures: readonly FigureOutput[], date: Date = new Date()): string {
  const r = plan.request;
  const descriptions = plan.candidates.map((c) => `<li><strong>${escapeHtml(c.name)}</strong> (${c.wellCount} wells, ${c.points.length} points): ${escapeHtml(c.description)}</li>`).join('\n');
  return `${pageHead('Experiment plan', `${REPORT_CSS}\npre.grid { font-size: 0.85rem; overflow-x: auto; }\n`)}
<body>
<header class="page">
<h1>Experiment plan</h1>
<p class="source">${escapeHtml(`${r.constraints.wells} wells · ${r.constraints.replicates} replicates per point · ${r.constraints.plate}-well plate · mechanisms in play: ${r.mechanisms.join(', ')}`)}</p>
</header>
<main>
<section id="recommendation">
<h2>Recommended design</h2>
<p>${escapeHtml(plan.recommended.description)} (${plan.recommended.wellCount} wells, ${plan.recommended.points.length} distinct points). The plate map is in <a href="plate-map.csv">plate-map.csv</a>. Wells per ([S] ${escapeHtml(r.units.substrate)}, [I] ${escapeHtml(r.units.inhibitor)}):</p>
${recommendedTable(plan)}
<p class="caution"><strong>The plan rests on its assumptions.</strong> The predictions below hold only as far as these do:</p>
<ul>${plan.assumptions.map((a) => `<li>${escapeHtml(a)}</li>`).join('')}</ul>
${plan.notes.length ? `<ul>${plan.notes.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>` : ''}
</section>
<section id="figures">
<h2>Figures</h2>
<div class="figure-grid">
${figures.map((f) => figureBlock(f)).join('\n')}
</div>
</section>
<section id="candidates">
<h2>Candidates compared</h2>
<p>${
    r.simulations > 0
      ? escapeHtml(`Predicted from ${r.simulations} simulations per design and true mechanism (seed ${r.seed}), each analysed by the same analysis as mechanist analyze (${JSON.stringify(plan.analysisOptions)}). "Firm" is the analysis's decisive call; for none, the no-inhibition outcome. Fold: high/low of the 95% interval, median over the simulations.`)
      : 'Information only (no simulation): the fold widths are expected from the Fisher information.'
  }</p>
${candidatesTable(plan)}
<ul>${descriptions}</ul>
</section>
<section id="methods">
<h2>Methods</h2>
<ul>
<li>Expected Fisher information from the models' analytic gradients, for weighted least squares with the noise model's weights (Seber &amp; Wild 1989; Atkinson, Donev &amp; Tobias 2007), averaged over the prior range (its ends and centre).</li>
<li>Ds criterion for Ki and Kiu; optimum weights by the multiplicative algorithm (Silvey, Titterington &amp; Torsney 1978) and efficient rounding (Pukelsheim &amp; Rieder 1992, from memory).</li>
<li>Discrimination: T-criterion noncentralities of the rival mechanisms (Atkinson &amp; Fedorov 1975), used to rank candidates only; inhibition models per Bogacka, Patan, Johnson, Youdim &amp; Atkinson (2011) J. Biopharm. Stat. 21, 555-572.</li>
<li>Common grid and single-[I] design as described by Jang et al. (2025) Nat. Commun. 16:5217; IC50 to Ki by Cheng &amp; Prusoff (1973).</li>
<li>Monte Carlo check through the analysis itself: seeded simulation, the same draws for every design.</li>
</ul>
</section>
<section id="cautions">
<h2>Cautions</h2>
<p>Research use only: a plan supports, and does not replace, the judgement of an enzymologist. The predicted shares are estimates with their own sampling error, and they follow the verdict rule of the installed version. [E] is not used by the plan (no tight-binding planning).</p>
</section>
</main>
<footer class="provenance"><p>${escapeHtml(`${TOOL_NAME} ${TOOL_VERSION} · ${date.toISOString().slice(0, 10)} · seed ${r.seed}`)}</p></footer>
</body>
</html>
`;
}
