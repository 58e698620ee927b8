import { describe, expect, it } from "vitest";
import { IngestError } from "@/lib/ingest";
import { normalizeName } from "@/lib/ingest/csv-table";
import { parseNumberAt, readBlankDelimitedNumber, readPlainCsvNumber } from "@/lib/ingest/number";
import { BYTE_SCAN_FROM, decodeInput, findControlChar, hasControlByte } from "@/lib/ingest/text-guards";
import { mulberry32 } from "@/lib/stats/seeded-random";

// The fast paths of DEVELOPERS.md ("Fast paths, same answers") against the full reading they
// stand in for, on seeded inputs.

function message(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof IngestError) return e.message;
    throw e;
  }
  return "(no error)";
}

/** Text of ASCII, line ends, tabs and 2–4-byte UTF-8 characters; now and then one control character. */
function seededText(random: () => number): string {
  const pieces = ["0.125", " ", ",", "\n", "\r\n", "\t", "\f", "µ", "°", "€", "𝄞", "~", "#", "Ω", "-3.5e-9"];
  const controls = [0, 1, 8, 11, 14, 27, 31, 127];
  const length = 1 + Math.floor(random() * 60);
  let text = "";
  for (let k = 0; k < length; k++) text += pieces[Math.floor(random() * pieces.length)];
  if (random() < 0.5) {
    const at = Math.floor(random() * (text.length + 1));
    const c = String.fromCharCode(controls[Math.floor(random() * controls.length)]);
    // Never inside a surrogate pair: the bytes must stay valid UTF-8.
    const safe = at > 0 && at < text.length && text.charCodeAt(at - 1) >= 0xd800 && text.charCodeAt(at - 1) <= 0xdbff ? at + 1 : at;
    text = text.slice(0, safe) + c + text.slice(safe);
  }
  return text;
}

describe("control characters found in the bytes, four at a time", () => {
  it("agrees with the string scan on 3,000 seeded texts at every alignment of the buffer", () => {
    const random = mulberry32(20261202);
    let withControl = 0;
    for (let n = 0; n < 3000; n++) {
      const text = seededText(random);
      const encoded = new TextEncoder().encode(text);
      const offset = n % 4;
      const backing = new Uint8Array(encoded.length + offset + 3);
      backing.fill(0x41);
      backing.set(encoded, offset);
      const bytes = backing.subarray(offset, offset + encoded.length);
      const expected = findControlChar(new TextDecoder().decode(bytes)) !== -1;
      if (expected) withControl++;
      expect(hasControlByte(bytes), JSON.stringify(text)).toBe(expected);
    }
    expect(withControl).toBeGreaterThan(1000);
  });

  it("finds each control byte at each position of a word, and none of tab, LF, FF, CR or 0x80–0xFF", () => {
    for (let c = 0; c < 256; c++) {
      for (let at = 0; at < 12; at++) {
        const bytes = new Uint8Array(12).fill(0x30);
        bytes[at] = c;
        const expected = (c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13) || c === 127;
        expect(hasControlByte(bytes), `byte ${c} at ${at}`).toBe(expected);
      }
    }
  });

  it("gives decodeInput the same message from bytes as from the decoded text (line of the character)", () => {
    const random = mulberry32(7);
    // Some large, some small enough (below BYTE_SCAN_FROM) to be checked as a string.
    const rows = "0.25,-3.5e-9\n".repeat(Math.ceil(BYTE_SCAN_FROM / 13));
    for (let n = 0; n < 400; n++) {
      const text = `# kind: drive-sweep\n${n % 2 === 0 ? rows : ""}${seededText(random)}\n${n % 4 === 1 ? rows : ""}`;
      if (text.includes("\u0000")) continue; // NUL bytes are refused earlier, as binary, by their byte
      const fromText = message(() => decodeInput({ fileName: "f.csv", text }));
      expect(message(() => decodeInput({ fileName: "f.csv", bytes: new TextEncoder().encode(text) }))).toBe(fromText);
    }
  });
});

/** A token as files write them, and now and then not a number: sign, 1–20 digits, a point, an exponent, stray text. */
function seededToken(random: () => number): string {
  const pick = <T,>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)];
  let token = pick(["", "", "", "-", "+", "--"]);
  const digits = 1 + Math.floor(random() * (random() < 0.8 ? 15 : 22));
  const dot = random() < 0.8 ? Math.floor(random() * (digits + 1)) : -1;
  for (let d = 0; d < digits; d++) {
    if (d === dot) token += ".";
    token += random() < 0.15 ? "0" : String(Math.floor(random() * 10));
  }
  if (dot === digits) token += ".";
  if (random() < 0.15) token += pick(["e", "E", "e-", "e+"]) + String(Math.floor(random() * 330));
  if (random() < 0.05) token = pick(["", ".", "-", "1..2", "0x1f", "NaN", "1,5", "∞", "2.5.", "1e", "+.5", "-.", "7a"]) || token;
  return token;
}

describe("Touchstone numbers read while their token's end is looked for", () => {
  it("gives parseNumberAt's value and the same token end on 40,000 seeded tokens", () => {
    const random = mulberry32(12);
    const out = new Float64Array(1);
    const blanks = [" ", "\t", "\r", "\f", "  "];
    let fallbacks = 0;
    for (let n = 0; n < 40_000; n++) {
      const token = seededToken(random);
      const after = random() < 0.3 ? "" : blanks[Math.floor(random() * blanks.length)] + "0.5";
      const text = `  ${token}${after}`;
      const start = 2;
      // The caller passes the line's end: the token may run into it or stop at a blank before it.
      const end = random() < 0.1 ? start + Math.max(1, Math.floor(random() * token.length)) : text.length;
      let tokenEnd = start + 1;
      while (tokenEnd < end && !" \t\r\f".includes(text[tokenEnd])) tokenEnd++;
      const expected = parseNumberAt(text, start, tokenEnd);
      const got = readBlankDelimitedNumber(text, start, end, out, 0);
      expect(got, JSON.stringify(text)).toBe(tokenEnd);
      expect(Object.is(out[0], expected) || (Number.isNaN(out[0]) && Number.isNaN(expected)), `${JSON.stringify(text)}: ${out[0]} vs ${expected}`).toBe(true);
      if (!/^[-+]?[0-9]*\.?[0-9]*$/.test(text.slice(start, tokenEnd)) || text.slice(start, tokenEnd).replace(/[^0-9]/g, "").length > 15) fallbacks++;
    }
    // Both sides of the fast path are exercised.
    expect(fallbacks).toBeGreaterThan(5_000);
    expect(fallbacks).toBeLessThan(35_000);
  });
});

describe("CSV cells read as plain numbers while their end is looked for", () => {
  it("gives the full reading's cell end and value (spaces and tabs trimmed, parseNumberAt) on 40,000 seeded cells", () => {
    const random = mulberry32(31);
    const out = new Float64Array(1);
    const delimiters = [",", ";", "\t"];
    let plain = 0;
    for (let n = 0; n < 40_000; n++) {
      const delimiter = delimiters[n % 3];
      const decimalComma = delimiter === ";";
      let token = seededToken(random);
      if (decimalComma && random() < 0.5) token = token.replace(".", ",");
      const pad = () => [" ", "", "", "  ", "\t"][Math.floor(random() * 5)];
      const cell = `${pad()}${random() < 0.03 ? "" : token}${pad()}`;
      const text = `x${delimiter}${cell}${random() < 0.5 ? `${delimiter}1.5` : ""}`;
      const start = 2;
      // The full reading: the cell runs to the next delimiter (or the line's end), trimmed of spaces and tabs.
      const next = text.indexOf(delimiter, start);
      const cellEnd = next === -1 ? text.length : next;
      let s = start;
      let e = cellEnd;
      while (s < e && (text[s] === " " || text[s] === "\t")) s++;
      while (e > s && (text[e - 1] === " " || text[e - 1] === "\t")) e--;
      const expected = parseNumberAt(text, s, e, decimalComma);
      const got = readPlainCsvNumber(text, start, text.length, delimiter.charCodeAt(0), decimalComma, out, 0);
      if (got === -1) continue;
      plain++;
      expect(got, JSON.stringify(text)).toBe(cellEnd);
      expect(Object.is(out[0], expected), `${JSON.stringify(text)}: ${out[0]} vs ${expected}`).toBe(true);
    }
    // Both sides of the fast path are exercised.
    expect(plain).toBeGreaterThan(10_000);
    expect(plain).toBeLessThan(35_000);
  });
});

describe("names already in their normal form", () => {
  it("normalizeName gives trim, lower case and one _ per run of blanks or hyphens on 20,000 seeded names", () => {
    const random = mulberry32(99);
    const pieces = ["a", "z", "k", "_", "0", "9", " ", "  ", "-", "`", "{", "/", "\t", "A", "Ö", "ä", "\u00a0", "\u2003", "[", "µ"];
    let unchanged = 0;
    for (let n = 0; n < 20_000; n++) {
      let raw = "";
      const length = Math.floor(random() * 12);
      // Mostly names a file would have ("input_power ", " kind"), now and then anything.
      const alphabet = random() < 0.6 ? pieces.slice(0, 8) : pieces;
      for (let k = 0; k < length; k++) raw += alphabet[Math.floor(random() * alphabet.length)];
      const full = raw.trim().toLowerCase().replace(/[\s-]+/g, "_");
      if (full === raw.trim()) unchanged++;
      expect(normalizeName(raw), JSON.stringify(raw)).toBe(full);
    }
    expect(unchanged).toBeGreaterThan(3_000);
  });
});
