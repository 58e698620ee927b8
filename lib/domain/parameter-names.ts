/**
 * The names of the harmonic orders, written once: the set page's parameter rows, the sheet's rows (web
 * and PDF, through the template) and every chart legend (lib/charts seriesLabel) take them from here,
 * so the 3rd harmonic is called the same wherever it is read. Pure: components import it.
 */

/** English ordinal suffix: 1st, 2nd, 3rd, 4th, 11th, 12th, 13th, 21st. */
function ordinal(n: number): string {
  const suffix = n % 100 >= 11 && n % 100 <= 13 ? "th" : n % 10 === 1 ? "st" : n % 10 === 2 ? "nd" : n % 10 === 3 ? "rd" : "th";
  return `${n}${suffix}`;
}

/** Order 1 is the fundamental; order n the "nth harmonic". */
export function harmonicOrderName(order: number): string {
  return order === 1 ? "fundamental" : `${ordinal(order)} harmonic`;
}

/** A harmonic-suppression figure's name: "Fundamental suppression", "3rd harmonic suppression". */
export function harmonicSuppressionLabel(order: number): string {
  const name = harmonicOrderName(order);
  return `${name[0].toUpperCase()}${name.slice(1)} suppression`;
}
