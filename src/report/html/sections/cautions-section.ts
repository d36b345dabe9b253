/** What the models assume, and what the report cannot check for the reader (own wording). */
import { escapeHtml } from '../escape.js';

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

export function cautionsSection(): string {
  return `<section id="cautions">
<h2>Before relying on these numbers</h2>
<ul class="cautions">${CAUTIONS.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>
</section>`;
}
