/**
 * Methods: the rate laws, the error model, how the fits were made, the criteria, the tests and the
 * intervals, each with the publication it comes from. Only the methods this analysis used are
 * listed (profile and bootstrap intervals appear when they were computed).
 */
import { FAMILY_LEVEL, TIGHT_BINDING_RATIO } from '../../../evidence/selection/family-comparison.js';
import type { AnalysisResult } from '../../../analysis/types.js';
import type { ErrorModel } from '../../../fit/error-models.js';
import { escapeHtml } from '../escape.js';
import { DETECTION_FACTOR } from '../../../evidence/intervals/detection-bound.js';
import { INHIBITION_LEVEL, MIXED_LEVEL, RIVAL_DELTA } from '../../../evidence/verdict/verdict.js';
import { ALPHA_FAR, EXCLUSION_LEVEL, NONCOMPETITIVE_BAND } from '../../../evidence/selection/alpha-exclusion.js';

const ERROR_MODEL_TEXT: Record<ErrorModel, string> = {
  constant: 'constant SD: every rate has the same standard deviation σ (unweighted least squares).',
  proportional: 'SD proportional to the rate: SD = σ·f, weights 1/f² with f the fitted rate, iterated to convergence (IRLS).',
  sqrt: 'SD proportional to the square root of the rate: SD = σ·√f, weights 1/f, iterated to convergence (IRLS).',
  column: 'per-row SD from the file’s sd column, up to a common factor σ: weights 1/sd².',
};

/**
 * The sources the methods cite, keyed for reuse. Authors, years, volumes and pages as in the
 * project brief (docs of each module name the same); the article titles are from memory.
 */
const REFERENCES = {
  segel: 'Segel, I. H. (1975) Enzyme Kinetics. Wiley, New York.',
  cornishBowden2012: 'Cornish-Bowden, A. (2012) Fundamentals of Enzyme Kinetics, 4th ed. Wiley-Blackwell, Weinheim.',
  more: 'Moré, J. J. (1978) The Levenberg-Marquardt algorithm: implementation and theory. In Numerical Analysis, Lecture Notes in Mathematics 630, 105-116. Springer.',
  carroll: 'Carroll, R. J. and Ruppert, D. (1988) Transformation and Weighting in Regression. Chapman & Hall, New York.',
  hurvich: 'Hurvich, C. M. and Tsai, C.-L. (1989) Regression and time series model selection in small samples. Biometrika 76, 297-307.',
  schwarz: 'Schwarz, G. (1978) Estimating the dimension of a model. Ann. Stat. 6, 461-464.',
  burnham: 'Burnham, K. P. and Anderson, D. R. (2002) Model Selection and Multimodel Inference, 2nd ed. Springer, New York.',
  draper: 'Draper, N. R. and Smith, H. (1998) Applied Regression Analysis, 3rd ed. Wiley, New York.',
  wilks: 'Wilks, S. S. (1938) The large-sample distribution of the likelihood ratio for testing composite hypotheses. Ann. Math. Stat. 9, 60-62.',
  selfLiang: 'Self, S. G. and Liang, K.-Y. (1987) Asymptotic properties of maximum likelihood estimators and likelihood ratio tests under nonstandard conditions. J. Am. Stat. Assoc. 82, 605-610.',
  batesWatts: 'Bates, D. M. and Watts, D. G. (1988) Nonlinear Regression Analysis and Its Applications. Wiley, New York.',
  efron: 'Efron, B. and Tibshirani, R. J. (1993) An Introduction to the Bootstrap. Chapman & Hall, New York.',
  lineweaverBurk: 'Lineweaver, H. and Burk, D. (1934) The determination of enzyme dissociation constants. J. Am. Chem. Soc. 56, 658-666.',
  dixon: 'Dixon, M. (1953) The determination of enzyme inhibitor constants. Biochem. J. 55, 170-171.',
  cornishBowden1974: 'Cornish-Bowden, A. (1974) A simple graphical method for determining the inhibition constants of mixed, uncompetitive and non-competitive inhibitors. Biochem. J. 137, 143-144.',
  morrison: 'Morrison, J. F. (1969) Kinetics of the reversible inhibition of enzyme-catalysed reactions by tight-binding inhibitors. Biochim. Biophys. Acta 185, 269-286.',
  waldWolfowitz: 'Wald, A. and Wolfowitz, J. (1940) On a test whether two samples are from the same population. Ann. Math. Stat. 11, 147-162.',
  royston: 'Royston, P. (1995) Remark AS R94: a remark on algorithm AS 181: the W-test for normality. Appl. Stat. 44, 547-551.',
  beatonTukey: 'Beaton, A. E. and Tukey, J. W. (1974) The fitting of power series, meaning polynomials, illustrated on band-spectroscopic data. Technometrics 16, 147-185.',
  chengPrusoff: 'Cheng, Y. and Prusoff, W. H. (1973) Relationship between the inhibition constant (K1) and the concentration of inhibitor which causes 50 per cent inhibition (I50) of an enzymatic reaction. Biochem. Pharmacol. 22, 3099-3108.',
  fengShoichet: 'Feng, B. Y. and Shoichet, B. K. (2006) A detergent-based assay for the detection of promiscuous inhibitors. Nat. Protoc. 1, 550-553.',
} as const;

type ReferenceKey = keyof typeof REFERENCES;

export function methodsSection(result: AnalysisResult): string {
  const estimates = result.models.flatMap((m) => m.estimates);
  const hasProfile = estimates.some((e) => e.profile) || result.models.some((m) => m.profiles?.length);
  const hasBootstrap = estimates.some((e) => e.bootstrapPercentile || e.bootstrapBca);
  const pct = Math.round(result.level * 100);
  const equations = result.models
    .slice()
    .sort((a, b) => a.p - b.p)
    .map((m) => `<li><strong>${escapeHtml(m.mechanism)}</strong>: <code>${escapeHtml(m.equation)}</code></li>`)
    .join('');
  const intervals = [
    `<li><strong>Wald intervals</strong> from the covariance s²(JᵀWJ)⁻¹ of the log-scale constants, carried to the natural scale by the delta method, with t quantiles on n − p degrees of freedom (Bates &amp; Watts 1988, sec. 2.3).</li>`,
    hasProfile
      ? `<li><strong>Profile-likelihood intervals</strong>: each constant is fixed along a grid and the others refitted; the interval holds the values whose profile t statistic stays within the ${pct}% t quantile (Bates &amp; Watts 1988, ch. 6). They need not be symmetric and do not depend on the parametrisation.</li>`
      : '',
    hasBootstrap ? `<li><strong>Bootstrap intervals</strong> (percentile and BCa) from seeded resampling and refitting (Efron &amp; Tibshirani 1993).</li>` : '',
  ].join('');
  return `<section id="methods">
<h2>Methods</h2>
<h3>Rate laws</h3>
<p>Rapid-equilibrium, single-substrate, reversible inhibition with [E] well below Ki (Segel 1975; Cornish-Bowden 2012). S = [S], I = [I]; Ki is the dissociation constant of EI, Kiu that of ESI, and alpha = Kiu/Ki.</p>
<ul class="equations">${equations}</ul>${familyMethods(result)}
<h3>Fitting</h3>
<p>All inhibitor series are fitted at once (global fit) by weighted nonlinear least squares on the untransformed rates, with the constants on the log scale so they stay positive, by Levenberg-Marquardt steps (Moré 1978) from several data-driven starts and warm starts from the nested models. Error model: ${escapeHtml(ERROR_MODEL_TEXT[result.errorModel])} Where the weights follow the fit they are iterated (Carroll &amp; Ruppert 1988) and the log-likelihood keeps the sum of log weights, so it stays comparable between mechanisms.</p>
<p>An inhibition constant above ${DETECTION_FACTOR} times the highest [I] tested changes the rate by under 1% anywhere in the design; it is reported as not detected rather than as a number (this project's rule).</p>
<h3>Choosing between mechanisms</h3>
<ul>
<li><strong>AICc</strong>, Akaike's criterion with the small-sample correction, counting the error variance as a constant (Hurvich &amp; Tsai 1989); <strong>BIC</strong> (Schwarz 1978); <strong>Akaike weights</strong> and the rule of thumb for AICc differences (Burnham &amp; Anderson 2002).</li>
<li><strong>Extra-sum-of-squares F test</strong> of nested models (Draper &amp; Smith 1998) and the <strong>likelihood-ratio test</strong> (Wilks 1938), conservative on the boundary of the fuller model (Self &amp; Liang 1987).</li>
<li><strong>The verdict</strong>: ${methodsVerdictText()}</li>
</ul>
<h3>Intervals (${pct}%)</h3>
<ul>${intervals}</ul>
<h3>Replots</h3>
<p>Double reciprocal (Lineweaver &amp; Burk 1934), Dixon (Dixon 1953), Cornish-Bowden (Cornish-Bowden 1974), Hanes-Woolf and Eadie-Hofstee (as in Cornish-Bowden 2012). They show the data transformed and the global fit transformed the same way; no constant is read from them.</p>
<h3>References</h3>
<ol class="references">${referenceList(usedOnlySometimes(result, hasBootstrap))}</ol>
</section>`;
}

/** The other families' rate laws and rule, when any were fitted (empty otherwise). */
function familyMethods(result: AnalysisResult): string {
  const models = result.familyModels ?? [];
  if (!models.length) return '';
  const equations = models.map((m) => `<li><strong>${escapeHtml(m.modelId ?? m.mechanism)}</strong>: <code>${escapeHtml(m.equation)}</code></li>`).join('');
  const tight = models.some((m) => m.family === 'tight-binding')
    ? `<p>Tight binding: total enzyme E and total inhibitor I, the Morrison quadratic (Morrison, J. F. (1969) Biochim. Biophys. Acta 185, 269-286), with the mechanism in the apparent constant K = Ki_app([S]) (Williams &amp; Morrison 1979; Copeland 2013, ch. 7), computed without cancellation. It replaces the classic call when Ki_app is within ${TIGHT_BINDING_RATIO}-fold of [E]t.</p>`
    : '';
  const partial = models.some((m) => m.family === 'partial')
    ? `<p>Partial (hyperbolic) inhibition: the enzyme-substrate-inhibitor complex turns over at beta times kcat (Segel 1975, ch. 4). Full inhibition, beta = 0, is a boundary, tested with the 50:50 chi-square mixture (Self &amp; Liang 1987) at p &lt; ${FAMILY_LEVEL}.</p>`
    : '';
  return `\n<h3>Other families fitted</h3>${tight}${partial}<ul class="equations">${equations}</ul>`;
}

/** References cited only when the method ran: true when it did. */
function usedOnlySometimes(result: AnalysisResult, hasBootstrap: boolean): Partial<Record<ReferenceKey, boolean>> {
  const ic50 = result.models.some((m) => m.derived?.some((d) => d.name === 'IC50'));
  return { efron: hasBootstrap, beatonTukey: result.robust !== undefined, chengPrusoff: ic50 };
}

function referenceList(conditional: Partial<Record<ReferenceKey, boolean>>): string {
  const keys = (Object.keys(REFERENCES) as ReferenceKey[]).filter((k) => conditional[k] ?? true);
  return keys
    .map((k) => REFERENCES[k])
    .sort((a, b) => a.localeCompare(b))
    .map((r) => `<li>${escapeHtml(r)}</li>`)
    .join('');
}

/** The verdict rule in one sentence, written from the constants the rule uses. */
export function methodsVerdictText(): string {
  return (
    `inhibition counts as detected when an inhibited model beats the model without inhibition at p &lt; ${INHIBITION_LEVEL}; ` +
    `mixed is preferred only when it has the lower AICc and the nested test rejects the best three-constant model at p &lt; ${MIXED_LEVEL}; ` +
    `a rival within ${RIVAL_DELTA} AICc units of the winner leaves the call open; ` +
    `a three-constant call is firm only when the data reject the nearest mixed alternative (one-sided profile tests on alpha at p &lt; ${EXCLUSION_LEVEL}: ` +
    `alpha &le; ${ALPHA_FAR} for competitive, alpha &ge; 1/${ALPHA_FAR} for uncompetitive, alpha outside ${1 / NONCOMPETITIVE_BAND}-${NONCOMPETITIVE_BAND} for noncompetitive); ` +
    'a mixed winner is described by the interval for alpha.'
  );
}
