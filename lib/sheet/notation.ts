/**
 * The sheet's notation for subscripts in plain strings: "T_A", "P_opt", "P_in − P_out". A word
 * joined to letters or digits by "_" is set with those as a subscript. Both renderers draw the
 * segments; the strings in the model stay plain text (searchable, and readable in the JSON).
 */
export type NotationSegment = { text: string; sub?: undefined } | { text: string; sub: string };

export function notationSegments(text: string): NotationSegment[] {
  const segments: NotationSegment[] = [];
  // Letters of any script ("σ_t", "φ_rms" as well as "T_A"), so the pattern marks word edges itself.
  const pattern = /(?<![\p{L}\p{N}_])(\p{L}+)_([\p{L}\p{N}]+)(?![\p{L}\p{N}_])/gu;
  let last = 0;
  for (const match of text.matchAll(pattern)) {
    if (match.index > last) segments.push({ text: text.slice(last, match.index) });
    segments.push({ text: match[1], sub: match[2] });
    last = match.index + match[0].length;
  }
  if (last < text.length) segments.push({ text: text.slice(last) });
  return segments;
}

/** A string in plain text, its subscripts set on the line ("T_A" → "TA"): issue messages, which are read and acknowledged as plain text. */
export function plainNotation(text: string): string {
  return notationSegments(text)
    .map((s) => s.text + (s.sub ?? ""))
    .join("");
}
