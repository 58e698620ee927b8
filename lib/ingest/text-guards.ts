import { IngestError } from "./errors";

export const DEFAULT_MAX_BYTES = 20 * 1024 * 1024;

export interface TextInput {
  fileName: string;
  /** Raw bytes as uploaded; preferred, so the size and encoding are checked exactly. */
  bytes?: Uint8Array;
  /** Already decoded text; its size is counted in UTF-16 code units. */
  text?: string;
  /** Size limit in bytes, checked before anything else (default 20 MiB). */
  maxBytes?: number;
}

// One decoder for every file: a decode() call without { stream: true } starts from a fresh
// decoder state (WHATWG Encoding, TextDecoder decode() step 1), even after a fatal error, and
// constructing a decoder per file was a measurable share of parsing many small files.
const STRICT_UTF8 = new TextDecoder("utf-8", { fatal: true, ignoreBOM: false });

/** Files from this size on are checked for control characters in their bytes (hasControlByte). */
export const BYTE_SCAN_FROM = 64;

function lineOfByte(bytes: Uint8Array, index: number): number {
  let line = 1;
  for (let i = 0; i < index; i++) if (bytes[i] === 10) line++;
  return line;
}

function lineOfChar(text: string, index: number): number {
  let line = 1;
  let at = text.indexOf("\n");
  while (at !== -1 && at < index) {
    line++;
    at = text.indexOf("\n", at + 1);
  }
  return line;
}

/**
 * Size, binary and encoding guards, then the decoded text without a BOM.
 * Control characters other than tab, CR, LF and form feed mark a binary file.
 */
export function decodeInput(input: TextInput): string {
  const { fileName } = input;
  const maxBytes = input.maxBytes ?? DEFAULT_MAX_BYTES;
  const size = input.bytes ? input.bytes.byteLength : (input.text ?? "").length;
  if (size > maxBytes) {
    throw new IngestError({
      fileName,
      code: "too-large",
      detail: `file is ${size} bytes, more than the limit of ${maxBytes} bytes`,
      expected: `at most ${maxBytes} bytes`,
    });
  }
  let text: string;
  if (input.bytes) {
    const bytes = input.bytes;
    const utf16 = utf16Order(bytes);
    if (utf16) {
      throw new IngestError({
        fileName,
        code: "invalid-encoding",
        detail: `this file is UTF-16 text (${utf16}); save it as UTF-8 (in a spreadsheet: "CSV UTF-8"; plain ASCII is fine too)`,
        expected: "UTF-8 text",
        found: "UTF-16",
      });
    }
    const nul = bytes.indexOf(0);
    if (nul !== -1) {
      throw new IngestError({
        fileName,
        code: "binary-file",
        line: lineOfByte(bytes, nul),
        detail: "this is a binary file (it contains NUL bytes); expected a text file",
        expected: "UTF-8 text",
      });
    }
    try {
      text = STRICT_UTF8.decode(bytes);
    } catch {
      const lossy = new TextDecoder("utf-8").decode(bytes);
      const bad = lossy.indexOf("\uFFFD");
      throw new IngestError({
        fileName,
        code: "invalid-encoding",
        line: bad === -1 ? undefined : lineOfChar(lossy, bad),
        detail: "the file is not valid UTF-8 text; save it as UTF-8 (plain ASCII is fine)",
        expected: "UTF-8 text",
      });
    }
  } else if (input.text !== undefined) {
    text = input.text.charCodeAt(0) === 0xfeff ? input.text.slice(1) : input.text;
  } else {
    text = "";
  }
  // From bytes, the control characters are looked for in the bytes four at a time (hasControlByte); the
  // string is scanned only when one is there, for the same position and message, or for a tiny file.
  const bad = input.bytes && input.bytes.length >= BYTE_SCAN_FROM && !hasControlByte(input.bytes) ? -1 : findControlChar(text);
  if (bad !== -1) {
    throw new IngestError({
      fileName,
      code: "binary-file",
      line: lineOfChar(text, bad),
      detail: `this looks like a binary file (control character U+${text
        .charCodeAt(bad)
        .toString(16)
        .padStart(4, "0")
        .toUpperCase()}); expected a text file`,
      expected: "text",
    });
  }
  if (text.length === 0) {
    throw new IngestError({ fileName, code: "empty-file", detail: "the file is empty" });
  }
  if (isBlank(text)) {
    throw new IngestError({ fileName, code: "empty-file", detail: "the file contains only whitespace" });
  }
  return text;
}

/**
 * The text of a parser's input. A string that already came out of decodeInput (flagged by
 * the caller, as parseMeasurementFile does) is used as it is: running the guards again would
 * rescan the whole text to find nothing. Only a leading BOM could still change it, so such a
 * text goes through decodeInput as before.
 */
export function readParserInput(input: TextInput & { content: string | Uint8Array; checked?: boolean }): string {
  const { fileName, content, maxBytes } = input;
  if (typeof content === "string") {
    if (input.checked && content.charCodeAt(0) !== 0xfeff) return content;
    return decodeInput({ fileName, text: content, maxBytes });
  }
  return decodeInput({ fileName, bytes: content, maxBytes });
}

/**
 * UTF-16 by its byte-order mark (FF FE little-endian, FE FF big-endian; Unicode Standard §23.8),
 * or, without one, by its NUL pattern: text in the Latin range written as UTF-16 has a NUL in
 * every other byte. Judged on the first 1,024 bytes: most of one parity NUL and almost none of
 * the other, so a binary file with scattered NULs is still called binary.
 */
function utf16Order(bytes: Uint8Array): string | undefined {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return "little-endian, byte-order mark FF FE";
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return "big-endian, byte-order mark FE FF";
  // Text in UTF-16 starts with a NUL in its first or second byte; anything else is not looked at further.
  if (bytes.length < 8 || (bytes[0] !== 0 && bytes[1] !== 0)) return undefined;
  const n = Math.min(bytes.length, 1024) & ~1;
  let evenNul = 0;
  let oddNul = 0;
  for (let i = 0; i < n; i += 2) {
    if (bytes[i] === 0) evenNul++;
    if (bytes[i + 1] === 0) oddNul++;
  }
  const pairs = n / 2;
  if (oddNul >= 0.8 * pairs && evenNul <= 0.05 * pairs) return "little-endian, no byte-order mark: a NUL after every character";
  if (evenNul >= 0.8 * pairs && oddNul <= 0.05 * pairs) return "big-endian, no byte-order mark: a NUL before every character";
  return undefined;
}

/** Index of the first control character other than tab, LF, FF and CR (U+0000–U+001F, U+007F), or -1. */
export function findControlChar(text: string): number {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) return i;
    if (c === 127) return i;
  }
  return -1;
}

function isBlank(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c !== 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) return false;
  }
  return true;
}

const isControlByte = (c: number) => (c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13) || c === 127;

/**
 * Whether UTF-8 bytes hold a character findControlChar would report: in UTF-8 the bytes below 0x80
 * are exactly the ASCII characters (every byte of a longer sequence is 0x80 or above), so the
 * question can be asked of the bytes. Four bytes at a time: (x − 0x20202020) & ~x & 0x80808080 is
 * non-zero exactly when a byte of x is below 0x20, and the same on x ^ 0x7f7f7f7f with 0x01010101
 * finds a 0x7F (Anderson, "Bit Twiddling Hacks": haszero and hasless); a word so flagged (each line
 * feed flags one) is looked at byte by byte. About five times quicker than the string loop on a
 * 4 MB Touchstone file.
 */
export function hasControlByte(bytes: Uint8Array): boolean {
  const n = bytes.length;
  let i = 0;
  // Up to the first 4-byte boundary of the buffer, then whole words, then the tail.
  const head = Math.min(n, (4 - (bytes.byteOffset & 3)) & 3);
  for (; i < head; i++) if (isControlByte(bytes[i])) return true;
  const words = (n - i) >> 2;
  if (words > 0) {
    const w = new Uint32Array(bytes.buffer, bytes.byteOffset + i, words);
    for (let k = 0; k < words; k++) {
      const x = w[k];
      const y = x ^ 0x7f7f7f7f;
      if ((((x - 0x20202020) & ~x) | ((y - 0x01010101) & ~y)) & 0x80808080) {
        const at = i + 4 * k;
        if (isControlByte(bytes[at]) || isControlByte(bytes[at + 1]) || isControlByte(bytes[at + 2]) || isControlByte(bytes[at + 3])) return true;
      }
    }
    i += 4 * words;
  }
  for (; i < n; i++) if (isControlByte(bytes[i])) return true;
  return false;
}
