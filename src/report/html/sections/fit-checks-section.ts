/**
 * Checks on the fit of the drawn model: the residual tests (runs, lack of fit, trends, normality),
 * the suspect points, the error-model comparison, each inhibitor series fitted alone, and the
 * robust refit when one was run. The other mechanisms' residual tests sit in a collapsed table.
 * Same thresholds and wording as the text summary (src/report/diagnostic-lines.ts) and the
 * verdict caveats (src/analysis/stage-diagnostics.ts).
 */
import type { AnalysisResult, ModelResult } from '../../../analysis/types.js';
import type { ResidualDiagnostics } from '../../../evidence/diagnostics/residual-diagnostics.js';
import { LEVERAGE_FACTOR, STUDENTISED_LIMIT } from '../../../evidence/diagnostics/residual-diagnostics.js';
import { LEVERAGED_RESIDUAL_LIMIT, pointsThatStandOut, standsOut } from '../../../evidence/diagnostics/standing-out.js';
import { CLEARLY_WORSE_DELTA } from '../../../evidence/diagnostics/error-model-check.js';
import { DOWN_WEIGHTED_BELOW } from '../../../evidence/diagnostics/robust-refit.js';
import { apparentConstants } from '../../../evidence/constants/apparent-constants.js';
import { DIAGNOSTIC_LEVEL } from '../../../analysis/stage-diagnostics.js';
import { drawnModel } from '../../../figures/figure-context.js';
import { displayUnit, withUnit as quantityWithUnit } from '../../../figures/axis-units.js';
import { escapeHtml } from '../escape.js';
import { pValue, sig } from '../../../text/format-number.js';
import { cell, htmlTable, type Cell } from '../html-table.js';
import { wordVerdict } from '../../../wording/verdict-words.js';

/** One residual test as a table row: what was tested, the statistic, p, and a plain reading. */
interface TestRow {
  test: string;
  statistic: string;
  p: number | null;
  reading: string;
  flagged: boolean;
}

function flaggedBelow(p: number | null): boolean {
  return p !== null && Number.isFinite(p) && p < DIAGNOSTIC_LEVEL;
}

/** The residual tests of one mechanism, in a fixed order. */
function residualTestRows(d: ResidualDiagnostics): TestRow[] {
  const rows: TestRow[] = [];
  const runs = d.runs;
  if (runs.method === 'not-applicable') {
    rows.push({ test: 'Runs of residual signs along [S]', statistic: `${runs.runs} runs`, p: null, reading: 'not testable: within every series the residuals share one sign', flagged: false });
  } else {
    const few = flaggedBelow(runs.pTooFew);
    rows.push({
      test: 'Runs of residual signs along [S]',
      statistic: `${runs.runs} runs (${sig(runs.expectedRuns, 3)} expected; ${runs.method})`,
      p: runs.pTooFew,
      reading: few ? 'long same-sign stretches: the curve misses the data systematically' : 'signs alternate as often as noise would make them',
      flagged: few,
    });
  }
  const lof = d.lackOfFit;
  if (lof.applicable) {
    const bad = flaggedBelow(lof.p);
    rows.push({
      test: 'Lack of fit against replicate scatter',
      statistic: `F = ${sig(lof.F, 3)} on ${lof.lackOfFitDf}, ${lof.pureErrorDf} df`,
      p: lof.p,
      reading: bad ? 'the curve departs from the replicate means by more than the replicates scatter' : 'the replicate means lie on the curve within their scatter',
      flagged: bad,
    });
  } else {
    rows.push({ test: 'Lack of fit against replicate scatter', statistic: '–', p: null, reading: `not tested: ${lof.reason}`, flagged: false });
  }
  const trendLabels = [
    ['substrate', '[S]'],
    ['inhibitor', '[I]'],
    ['fitted', 'the fitted rate'],
  ] as const;
  for (const [key, label] of trendLabels) {
    const t = d.trends[key];
    const drift = flaggedBelow(t.p);
    rows.push({
      test: `Trend of residuals with ${label}`,
      statistic: `Spearman rho = ${Number.isFinite(t.rho) ? t.rho.toFixed(2) : '–'}`,
      p: Number.isFinite(t.p) ? t.p : null,
      reading: drift ? `the residuals drift with ${label}` : 'no drift',
      flagged: drift,
    });
  }
  if (d.normality) {
    const off = flaggedBelow(d.normality.p);
    rows.push({
      test: 'Normality of studentised residuals',
      statistic: `Shapiro-Wilk W = ${d.normality.W.toFixed(3)}`,
      p: d.normality.p,
      reading: off ? 'not normal: the intervals may be off' : 'consistent with normal errors',
      flagged: off,
    });
  } else {
    rows.push({ test: 'Normality of studentised residuals', statistic: '–', p: null, reading: 'not tested (needs 3 to 5000 residuals that are not all equal)', flagged: false });
  }
  return rows;
}

function testsTable(d: ResidualDiagnostics): string {
  return htmlTable(
    [cell('check'), cell('statistic', true), cell('p', true), cell('reading')],
    residualTestRows(d).map((r) => [
      cell(escapeHtml(r.test)),
      cell(escapeHtml(r.statistic), true),
      cell(escapeHtml(r.p === null ? '–' : pValue(r.p)), true),
      cell(escapeHtml(r.reading), false, r.flagged ? 'warn' : ''),
    ]),
    'data checks-tests',
  );
}

function units(result: AnalysisResult): { s: string | null; i: string | null; v: string | null } {
  const u = result.input.units;
  return { s: displayUnit(u.substrate), i: displayUnit(u.inhibitor), v: displayUnit(u.rate) };
}

function withUnit(q: string, unit: string | null): string {
  return escapeHtml(quantityWithUnit(q, unit));
}

function suspectsBlock(result: AnalysisResult, model: ModelResult, d: ResidualDiagnostics): string {
  const u = units(result);
  const limit = (LEVERAGE_FACTOR * model.p) / model.n;
  const rule = `externally studentised residual is beyond ±${STUDENTISED_LIMIT}, or the leverage is above ${LEVERAGE_FACTOR}p/n = ${sig(limit, 2)} and the residual beyond ±${LEVERAGED_RESIDUAL_LIMIT}`;
  const { suspects, leverageOnly } = pointsThatStandOut(d);
  const onCurve = leverageOnly
    ? ` ${leverageOnly} point${leverageOnly > 1 ? 's have' : ' has'} high leverage but ${leverageOnly > 1 ? 'sit' : 'sits'} on the curve (a property of the design, such as the highest [S]); not listed.`
    : '';
  if (suspects.length === 0) return `<p>No point stands out (flagged when the ${escapeHtml(rule)}).${escapeHtml(onCurve)}</p>`;
  const table = htmlTable(
    [cell('line', true), cell(withUnit('[S]', u.s), true), cell(withUnit('[I]', u.i), true), cell(withUnit('v', u.v), true), cell('studentised residual', true), cell('leverage', true), cell('why')],
    suspects.map((s) => [
      cell(escapeHtml(String(result.table.points[s.index]?.line ?? '–')), true),
      cell(escapeHtml(sig(s.substrate, 4)), true),
      cell(escapeHtml(sig(s.inhibitor, 4)), true),
      cell(escapeHtml(sig(s.rate, 4)), true),
      cell(escapeHtml(sig(s.studentised, 3)), true),
      cell(escapeHtml(sig(s.leverage, 2)), true),
      cell(escapeHtml(s.why)),
    ]),
    'data suspects',
  );
  return `<p>Flagged when the ${escapeHtml(rule)}. Flagged points stay in the fit.${escapeHtml(onCurve)}</p>\n${table}`;
}

function errorModelBlock(result: AnalysisResult): string {
  const em = result.errorModelCheck;
  const automatic = result.errorModelChoice?.automatic === true;
  const how = automatic
    ? `The ${result.errorModel} error model was chosen automatically: under it the best mechanism has the lowest AICc of all usable error models.`
    : `The ${result.errorModel} error model was given for this analysis, not chosen by the data.`;
  if (!em) return `<p>${escapeHtml(how)} The error models were not compared (no residual degrees of freedom).</p>`;
  const table = htmlTable(
    [cell('error model'), cell('log L', true), cell('AICc', true), cell('ΔAICc', true), cell('')],
    em.scores.map((s) => {
      const marks = [s.errorModel === em.chosen ? 'used' : '', s.errorModel === em.best ? 'best' : ''].filter(Boolean).join(', ');
      return [
        cell(escapeHtml(s.errorModel)),
        cell(escapeHtml(Number.isFinite(s.logLik) ? s.logLik.toFixed(2) : '–'), true),
        cell(escapeHtml(Number.isFinite(s.aicc) ? s.aicc.toFixed(2) : '–'), true),
        cell(escapeHtml(Number.isFinite(s.delta) ? s.delta.toFixed(1) : '–'), true),
        cell(escapeHtml(marks)),
      ];
    }),
    'data error-models',
  );
  const chosen = em.scores.find((s) => s.errorModel === em.chosen);
  const gap = chosen ? chosen.delta : NaN;
  const standing = em.chosen === em.best
    ? `${em.chosen} is the best of these.`
    : em.clearlyWorse
      ? `${em.chosen} is clearly worse than ${em.best} (ΔAICc ${gap.toFixed(1)}, above ${CLEARLY_WORSE_DELTA}).`
      : `${em.chosen} is not clearly worse than ${em.best} (ΔAICc ${gap.toFixed(1)}, within ${CLEARLY_WORSE_DELTA}).`;
  const skipped = em.skipped.length ? ` Not scored: ${em.skipped.map((s) => `${s.errorModel} (${s.reason})`).join('; ')}.` : '';
  return `<p>${escapeHtml(`${how} The ${em.mechanism} model refitted under each error model, compared by AICc of the weighted likelihood: ${standing}${skipped}`)}</p>
${table}`;
}

function plusMinus(value: number, se: number | null): string {
  return se === null || !Number.isFinite(se) ? sig(value, 4) : `${sig(value, 4)} ± ${sig(se, 2)}`;
}

function seriesBlock(result: AnalysisResult, model: ModelResult): string {
  const series = result.seriesFits ?? [];
  if (series.length === 0) return '<p>No inhibitor series has three or more [S] levels, so none was fitted alone.</p>';
  const u = units(result);
  const disagreements = result.seriesDisagreements ?? [];
  const flag = (inhibitor: number, quantity: 'Vmax' | 'Km'): string => {
    const d = disagreements.find((x) => x.inhibitor === inhibitor && x.quantity === quantity);
    return d ? `differs (z = ${d.z.toFixed(1)})` : '';
  };
  const rows: Cell[][] = series.map((sf) => {
    const implied = apparentConstants(model.fit, sf.inhibitor);
    const vFlag = flag(sf.inhibitor, 'Vmax');
    const kFlag = flag(sf.inhibitor, 'Km');
    const mark = [vFlag && `Vmax ${vFlag}`, kFlag && `Km ${kFlag}`].filter(Boolean).join('; ');
    return [
      cell(escapeHtml(sig(sf.inhibitor, 4)), true),
      cell(String(sf.n), true),
      cell(escapeHtml(sf.converged ? plusMinus(sf.Vmax, sf.seVmax) : 'not converged'), true, vFlag ? 'warn' : ''),
      cell(escapeHtml(sig(implied.Vmax, 4)), true),
      cell(escapeHtml(sf.converged ? plusMinus(sf.Km, sf.seKm) : 'not converged'), true, kFlag ? 'warn' : ''),
      cell(escapeHtml(sig(implied.Km, 4)), true),
      cell(escapeHtml(mark || 'agrees'), false, mark ? 'warn' : ''),
    ];
  });
  const table = htmlTable(
    [
      cell(withUnit('[I]', u.i), true),
      cell('n', true),
      cell(withUnit('Vmax alone ± SE', u.v), true),
      cell(escapeHtml(`Vmax from ${model.mechanism}`), true),
      cell(withUnit('Km alone ± SE', u.s), true),
      cell(escapeHtml(`Km from ${model.mechanism}`), true),
      cell('agreement'),
    ],
    rows,
    'data series-fits',
  );
  const summary = disagreements.length
    ? `${disagreements.length} apparent constant${disagreements.length > 1 ? 's differ' : ' differs'} from the global fit by more than 3 SE of the series fit.`
    : 'Every series agrees with the global fit within 3 SE of its own fit.';
  return `<p>${escapeHtml(`Each [I] series fitted alone to the Michaelis-Menten equation, beside the apparent constants the global ${model.mechanism} fit implies at that [I]. A diagnostic only: no reported constant comes from these fits. ${summary}`)}</p>
${table}`;
}

function robustBlock(result: AnalysisResult): string {
  const r = result.robust;
  if (!r) return '';
  const u = units(result);
  const points = r.downWeighted.length
    ? htmlTable(
        [cell('line', true), cell(withUnit('[S]', u.s), true), cell(withUnit('[I]', u.i), true), cell(withUnit('v', u.v), true), cell('robust weight', true)],
        r.downWeighted.map((p) => [
          cell(escapeHtml(String(p.line)), true),
          cell(escapeHtml(sig(p.substrate, 4)), true),
          cell(escapeHtml(sig(p.inhibitor, 4)), true),
          cell(escapeHtml(sig(p.rate, 4)), true),
          cell(escapeHtml(p.weight === 0 ? '0 (left out)' : p.weight.toFixed(3)), true),
        ]),
        'data down-weighted',
      )
    : `<p>No point was given a weight below ${DOWN_WEIGHTED_BELOW}.</p>`;
  const best = r.ranking.length ? r.ranking[0].aicc : NaN;
  const ranking = htmlTable(
    [cell('rank', true), cell('mechanism'), cell('AICc', true), cell('ΔAICc', true), cell('Akaike weight', true)],
    r.ranking.map((m, k) => [
      cell(String(k + 1), true),
      cell(escapeHtml(m.mechanism)),
      cell(escapeHtml(Number.isFinite(m.aicc) ? m.aicc.toFixed(2) : '–'), true),
      cell(escapeHtml(Number.isFinite(m.aicc - best) ? (m.aicc - best).toFixed(2) : '–'), true),
      cell(escapeHtml(m.weight > 0.999 ? '> 0.999' : m.weight < 0.001 ? '< 0.001' : m.weight.toFixed(3)), true),
    ]),
    'data robust-ranking',
  );
  const robustHeadline = wordVerdict(r.verdict).headline;
  const call = r.changesVerdict
    ? `<p class="warn"><strong>The call changes:</strong> ${escapeHtml(`with these points down-weighted, the robust fits say: ${robustHeadline} The least-squares call depends on them.`)}</p>`
    : `<p><strong>The call stands:</strong> ${escapeHtml(`the robust fits say: ${robustHeadline}`)}</p>`;
  return `<h3>Robust refit</h3>
<p>${escapeHtml(`Tukey's bisquare weights (Beaton & Tukey 1974) found on the mixed fit, then held fixed while all mechanisms were refitted.${r.downWeighted.length ? ` Points weighted below ${DOWN_WEIGHTED_BELOW}: ${r.downWeighted.length}.` : ''}`)}</p>
${points}
${call}
<details class="robust-ranking"><summary>Robust ranking of the mechanisms</summary>
${ranking}
</details>`;
}

function otherMechanismsBlock(result: AnalysisResult, model: ModelResult): string {
  const checks = result.residualChecks ?? {};
  const others = result.models.filter((m) => m !== model && checks[m.mechanism]);
  if (others.length === 0) return '';
  const p = (x: number | null | undefined, flagged: boolean) => cell(escapeHtml(x === null || x === undefined || !Number.isFinite(x) ? '–' : pValue(x)), true, flagged ? 'warn' : '');
  const rows = others.map((m) => {
    const d = checks[m.mechanism]!;
    const lof = d.lackOfFit.applicable ? d.lackOfFit.p : null;
    return [
      cell(escapeHtml(m.mechanism)),
      p(d.runs.pTooFew, flaggedBelow(d.runs.pTooFew)),
      p(lof, flaggedBelow(lof)),
      p(d.trends.substrate.p, flaggedBelow(d.trends.substrate.p)),
      p(d.trends.inhibitor.p, flaggedBelow(d.trends.inhibitor.p)),
      p(d.trends.fitted.p, flaggedBelow(d.trends.fitted.p)),
      p(d.normality?.p, flaggedBelow(d.normality?.p ?? null)),
      cell(escapeHtml(d.suspects.some(standsOut) ? d.suspects.filter(standsOut).map((s) => result.table.points[s.index]?.line ?? '?').join(', ') : 'none')),
    ];
  });
  return `<details class="other-checks"><summary>Residual checks of the other mechanisms</summary>
${htmlTable(
  [cell('mechanism'), cell('runs p', true), cell('lack of fit p', true), cell('trend [S] p', true), cell('trend [I] p', true), cell('trend fitted p', true), cell('Shapiro-Wilk p', true), cell('suspect lines')],
  rows,
  'data other-checks',
)}
</details>`;
}

export function fitChecksSection(result: AnalysisResult): string {
  const model = drawnModel(result);
  const d = model.modelId ? result.familyResidualChecks?.[model.modelId] : result.residualChecks?.[model.mechanism];
  const tests = d
    ? `${testsTable(d)}\n<h3>Suspect points</h3>\n${suspectsBlock(result, model, d)}`
    : '<p>The residual tests need residual degrees of freedom; this fit has none.</p>';
  return `<section id="checks">
<h2>Checks on the ${escapeHtml(model.modelId ?? model.mechanism)} fit</h2>
<p class="lead">${escapeHtml(`Does the ${model.modelId ?? model.mechanism} model miss the data somewhere? A check is marked when its p falls below ${DIAGNOSTIC_LEVEL}. Runs (Wald & Wolfowitz 1940) follow the mean residual of each condition along [S] within each [I] series; lack of fit compares with the replicate scatter (Draper & Smith 1998); trends are Spearman rank correlations; normality is Shapiro-Wilk (Royston 1995).`)}</p>
${tests}
<h3>Error model</h3>
${errorModelBlock(result)}
<h3>Each series fitted alone</h3>
${seriesBlock(result, model)}
${robustBlock(result)}
${otherMechanismsBlock(result, model)}
</section>`;
}
