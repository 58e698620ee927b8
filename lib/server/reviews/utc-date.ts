/** The UTC calendar date of an instant (YYYY-MM-DD): the date a sheet is submitted or released on. */
export function utcDate(at: Date): string {
  return at.toISOString().slice(0, 10);
}
