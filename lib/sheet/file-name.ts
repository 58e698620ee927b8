/** "KDX-2G4-rev-B.pdf", or "KDX-2G4-draft.pdf" before release; only safe filename characters. */
export function sheetPdfFileName(partNumber: string, revisionLabel: string | null): string {
  const safe = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, "_");
  return `${safe(partNumber)}-${revisionLabel ? `rev-${safe(revisionLabel)}` : "draft"}.pdf`;
}
