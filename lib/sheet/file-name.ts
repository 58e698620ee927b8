/** "KDX-2G4-rev-B.pdf", or "KDX-2G4-draft.pdf" before release; only safe filename characters. */
export function sheetPdfFileName(partNumber: string, revisionLabel: string | null): string {
  const safe = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, "_");
  return `${safe(partNumber)}-${revisionLabel ? `rev-${safe(revisionLabel)}` : "draft"}.pdf`;
}

/** A file-name part: only safe filename characters, runs of others one underscore, none at either end. */
function safePart(s: string): string {
  return s.replace(/\u2212/g, "-").replace(/\s*°\s*/gu, "").replace(/[^A-Za-z0-9.-]+/g, "_").replace(/^[_.]+|[_.]+$/g, "") || "x";
}

/** One Touchstone set behind a released revision, as its frozen model lists it. */
export type ReleasedTouchstoneEntry = { setId: string; serial: string; temperature: string; portCount: number };

/**
 * "KQH-2G_revA_BFD-0301_25C.s4p": part, revision letter, unit serial and condition (the set's
 * temperature as the sheet prints it, "−40°C" → "-40C"), with the file's own port count in the
 * extension (Touchstone 1.1: .sNp). Two sets that would share a name both get their set id added.
 */
export function touchstoneFileNames(opts: { partNumber: string; letter: string; sets: ReleasedTouchstoneEntry[] }): Map<string, string> {
  const base = (s: ReleasedTouchstoneEntry) =>
    `${safePart(opts.partNumber)}_rev${safePart(opts.letter)}_${safePart(s.serial)}_${s.temperature ? safePart(s.temperature) : "nominal"}`;
  const counts = new Map<string, number>();
  for (const s of opts.sets) counts.set(base(s) + s.portCount, (counts.get(base(s) + s.portCount) ?? 0) + 1);
  return new Map(
    opts.sets.map((s) => {
      const unique = counts.get(base(s) + s.portCount) === 1;
      return [s.setId, `${base(s)}${unique ? "" : `_set${safePart(s.setId)}`}.s${Math.max(1, Math.trunc(s.portCount))}p`];
    }),
  );
}

/** The condition a merged Touchstone file stands for, as an address part: "25C-s4p", "-40C-s2p", "nominal-s3p". */
export function touchstoneGroupId(temperature: string, portCount: number): string {
  return `${temperature ? safePart(temperature) : "nominal"}-s${Math.max(1, Math.trunc(portCount))}p`;
}

/** "KQH-2G_revA_median-of-5_25C.s4p": the median unit of a condition's released sets. */
export function medianTouchstoneFileName(opts: { partNumber: string; letter: string; unitCount: number; temperature: string; portCount: number }): string {
  return `${safePart(opts.partNumber)}_rev${safePart(opts.letter)}_median-of-${opts.unitCount}_${opts.temperature ? safePart(opts.temperature) : "nominal"}.s${Math.max(1, Math.trunc(opts.portCount))}p`;
}

/** "KQH-2G-rev-A-specifications.csv". */
export function specificationsCsvFileName(partNumber: string, letter: string): string {
  return sheetPdfFileName(partNumber, letter).replace(/\.pdf$/, "-specifications.csv");
}

/**
 * `attachment; filename="…"` for any stored name: an ASCII fallback of safe characters, and the name
 * itself as RFC 6266 / RFC 8187 `filename*` (UTF-8, percent-encoded) when it differs.
 */
export function attachmentDisposition(fileName: string): string {
  const fallback = fileName.replace(/[^A-Za-z0-9._-]+/g, "_").slice(0, 200) || "download";
  if (fallback === fileName) return `attachment; filename="${fallback}"`;
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}
