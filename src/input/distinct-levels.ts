/** The distinct values of a concentration column (substrate or inhibitor levels), ascending. */
export function distinctLevels(values: Iterable<number> | ArrayLike<number>): number[] {
  return [...new Set(Array.from(values))].sort((a, b) => a - b);
}
