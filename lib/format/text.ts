/** A label inside a sentence: "Input 1 dB compression" → "input 1 dB compression"; "LO drive", "RF frequency" and "VSWR" keep their capitals. */
export function lowerFirst(text: string): string {
  return /^[A-Z][a-z]/.test(text) ? text.charAt(0).toLowerCase() + text.slice(1) : text;
}

/** A name at the start of a sentence or a row: "fundamental suppression" → "Fundamental suppression". */
export function upperFirst(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
