/** What the models assume, and what the report cannot check for the reader (own wording). */
import { escapeHtml } from '../escape.js';
import type { AnalysisResult } from '../../../analysis/types.js';

export const CAUTIONS: readonly string[] = [
  'This is a research tool. It organises the evidence; the call on a compound stays with someone who knows the assay.',
  'The rates must be initial rates: product build-up and substrate depletion bend the curves in ways no inhibition model describes (common practice: under about 10% of the substrate used).',
  'Binding is taken to be reversible and at equilibrium during the measurement.',
  'The enzyme concentration must be well below Ki. When they are comparable, inhibitor is depleted by binding and the tight-binding treatment (Morrison 1969) is needed instead.',
  'Inhibition that develops over time would be misread as weaker or as another mechanism: compare rates with and without preincubation of enzyme and compound.',
  'Colloidal aggregates of a compound inhibit many enzymes unspecifically; a repeat with a little non-ionic detergent in the buffer tells them apart (Feng & Shoichet 2006).',
  'A compound that absorbs or fluoresces at the read-out wavelengths distorts the rates it seems to change; check the signal of compound alone.',
  'The replots are drawn for the eye only. Every constant in this report comes from the global fit of the untransformed rates.',
];

/** Cautions that replace or add to the list when the tight-binding or partial family was fitted. */
const TIGHT_BINDING_CAUTION =
  'The tight-binding models take [E]t to be the concentration of active enzyme: a nominal protein concentration that includes inactive enzyme overstates it and biases Ki; an active-site titration gives the right value, and --enzyme fit estimates it when [I] spans it.';
const PARTIAL_CAUTION =
  'A rate that levels off at high [I] can also come from the compound reaching its solubility limit or forming aggregates; check the top concentrations before reading the plateau as partial inhibition.';

export function cautionsSection(result?: AnalysisResult): string {
  const tight = result?.enzyme !== null && result?.enzyme !== undefined;
  const partial = result?.familyModels?.some((m) => m.family === 'partial') ?? false;
  const items = CAUTIONS.map((c, k) => (tight && k === 3 ? TIGHT_BINDING_CAUTION : c));
  if (partial) items.push(PARTIAL_CAUTION);
  return `<section id="cautions">
<h2>Before relying on these numbers</h2>
<ul class="cautions">${items.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>
</section>`;
}
