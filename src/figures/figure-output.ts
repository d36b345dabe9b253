/** A rendered figure: the standalone SVG plus what the report page needs to place it. */
export type FigureGroup = 'fit' | 'evidence' | 'replot' | 'uncertainty';

export interface FigureOutput {
  /** element id inside the report, e.g. "fig-rate-curves" */
  id: string;
  /** file name under figures/, e.g. "rate-curves.svg" */
  file: string;
  group: FigureGroup;
  title: string;
  /** the caption printed under the figure in the report (the SVG carries its own <desc>) */
  caption: string;
  svg: string;
}
