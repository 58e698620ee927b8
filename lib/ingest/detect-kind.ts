import { normalizeName } from "./csv-table";
import { outsideQuotes, splitCsvLine } from "./csv-tokens";
import { IngestError, shortenFound } from "./errors";
import { portsFromExtension } from "./touchstone";
import { measurementKinds } from "../domain/measurements";
import type { MeasurementKind } from "./types";

/** Only the start of a file is looked at: metadata and the header come first. */
const DETECT_WINDOW_CHARS = 64 * 1024;
const TOUCHSTONE_OPTION_TOKENS = new Set(["hz", "khz", "mhz", "ghz", "s", "y", "z", "h", "g", "ri", "ma", "db", "r"]);

function looksLikeOptionLine(body: string): boolean {
  const tokens = body.trim().split(/[ \t]+/).filter((t) => t !== "");
  if (tokens.length === 0) return true;
  return tokens.every((t, k) => TOUCHSTONE_OPTION_TOKENS.has(t.toLowerCase()) || (k > 0 && tokens[k - 1].toLowerCase() === "r"));
}

function headerNames(line: string): string[] {
  const bare = outsideQuotes(line);
  const delimiter = bare.includes("\t") ? "\t" : bare.includes(";") ? ";" : ",";
  return splitCsvLine(line, delimiter).map((cell) => {
    const open = cell.indexOf("[");
    return normalizeName(open === -1 ? cell : cell.slice(0, open));
  });
}

function kindFromHeader(names: string[]): MeasurementKind | undefined {
  const has = (n: string) => names.includes(n);
  if (has("offset") && has("l")) return "phase-noise";
  if (has("im3_out")) return "two-tone";
  if (has("input_power") && names.some((n) => /^p[1-9][0-9]?_out$/.test(n))) return "drive-sweep";
  if (has("frequency")) return "frequency-sweep";
  return undefined;
}

/**
 * The kind of a measurement file: Touchstone from a ".sNp"/".ts" extension or
 * its first line; CSV kinds from a "# kind:" metadata line, else from the
 * header's column names. Throws IngestError "unknown-kind" when neither says.
 */
export function detectKind(fileName: string, text: string): MeasurementKind {
  if (portsFromExtension(fileName) !== undefined || /\.ts$/i.test(fileName)) return "touchstone";
  const head = text.length > DETECT_WINDOW_CHARS ? text.slice(0, DETECT_WINDOW_CHARS) : text;
  let pos = head.charCodeAt(0) === 0xfeff ? 1 : 0;
  let lineNo = 0;
  while (pos < head.length) {
    lineNo++;
    const nl = head.indexOf("\n", pos);
    const line = head.slice(pos, nl === -1 ? head.length : nl).trim();
    pos = nl === -1 ? head.length : nl + 1;
    if (line === "" || line.startsWith("!")) continue;
    if (line.startsWith("[")) {
      if (line.toLowerCase().replace(/\s+/g, "").startsWith("[version]")) return "touchstone";
      break;
    }
    if (line.startsWith("#")) {
      const body = line.slice(1);
      const colon = body.indexOf(":");
      if (colon === -1) {
        if (looksLikeOptionLine(body)) return "touchstone";
        continue;
      }
      if (normalizeName(body.slice(0, colon)) === "kind") {
        const value = body.slice(colon + 1).trim().toLowerCase();
        if ((measurementKinds as readonly string[]).includes(value)) return value as MeasurementKind;
        throw new IngestError({
          fileName,
          code: "unknown-kind",
          line: lineNo,
          field: "kind",
          expected: measurementKinds.join(", "),
          found: shortenFound(value),
          detail: `unknown kind "${shortenFound(value)}"; expected one of ${measurementKinds.join(", ")}`,
        });
      }
      continue;
    }
    const kind = kindFromHeader(headerNames(line));
    if (kind) return kind;
    throw new IngestError({
      fileName,
      code: "unknown-kind",
      line: lineNo,
      found: shortenFound(line),
      detail: `cannot tell the measurement kind from the header "${shortenFound(line)}"; add a "# kind: drive-sweep" line (or frequency-sweep, two-tone, phase-noise) or use the column names in FORMATS.md`,
    });
  }
  throw new IngestError({
    fileName,
    code: "unknown-kind",
    detail: 'cannot tell the measurement kind: no "# kind:" line, no header row and no Touchstone option line near the start of the file',
  });
}
