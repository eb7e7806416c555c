// How many curves one overlay holds: beyond a dozen, colours and dash patterns stop being told apart (palette.ts).
export const MAX_COMPARE_CURVES = 12;

export function basketFullMessage(max = MAX_COMPARE_CURVES): string {
  return `The compare basket holds at most ${max} curves, so one overlay stays readable. Remove a curve to add another.`;
}
