/**
 * The compare page's selection as it lives in the address: `?sheets=<org>/<part>/<rev>,…`, two to
 * four released sheets, each named by its public address (organization slug, part number, and a
 * revision letter or "current"). The catalog's "Compare" form sends one `sheets` per ticked box, so
 * repeated parameters are read too. Pure: the page and GET /api/v1/compare/csv read it alike.
 */

export const COMPARE_MIN_SHEETS = 2;
export const COMPARE_MAX_SHEETS = 4;
/** Longer than four real addresses could ever be: a selection past it is refused before it is split. */
const MAX_SELECTION_CHARS = 1000;

export type CompareSheetRef = { organizationSlug: string; partNumber: string; revision: string };
export type CompareSelectionIssue = { field: "sheets"; message: string };
export type CompareSelectionResult = { ok: true; sheets: CompareSheetRef[] } | { ok: false; issues: CompareSelectionIssue[] };

type Params = { getAll(name: string): string[] };

const SLUG = /^[a-z0-9][a-z0-9-]{0,63}$/;
// As lib/schemas/measurements.ts accepts a part number: a letter or digit, then letters, digits, . _ - /
const PART = /^[A-Za-z0-9][A-Za-z0-9._\-/]{0,63}$/;
const REVISION = /^(?:[A-Z]{1,3}|current)$/;

/** Reads `sheets` (URLSearchParams or a page's searchParams object). Every problem is said in words that name the entry. */
export function parseCompareSelection(input: Params | Record<string, string | string[] | undefined>): CompareSelectionResult {
  const values = toParams(input).getAll("sheets");
  const joined = values.join(",");
  if (joined.length > MAX_SELECTION_CHARS) {
    return fail(`The selection is ${joined.length} characters long; at most ${MAX_SELECTION_CHARS} are read.`);
  }
  const entries = values.flatMap((v) => v.split(",")).map((e) => e.trim()).filter(Boolean);
  const issues: CompareSelectionIssue[] = [];
  const sheets: CompareSheetRef[] = [];
  for (const entry of entries) {
    const parsed = parseEntry(entry);
    if (typeof parsed === "string") issues.push({ field: "sheets", message: parsed });
    else if (!sheets.some((s) => compareSheetKey(s) === compareSheetKey(parsed))) sheets.push(parsed);
  }
  if (issues.length) return { ok: false, issues };
  if (sheets.length < COMPARE_MIN_SHEETS) {
    return fail(
      sheets.length === 0
        ? `Pick ${COMPARE_MIN_SHEETS} to ${COMPARE_MAX_SHEETS} released sheets to compare (none was given).`
        : `Pick ${COMPARE_MIN_SHEETS} to ${COMPARE_MAX_SHEETS} released sheets to compare; ${sheets.length === 1 ? "only one was given" : `${sheets.length} were given`}.`,
    );
  }
  if (sheets.length > COMPARE_MAX_SHEETS) {
    return fail(`At most ${COMPARE_MAX_SHEETS} sheets can be compared at once; ${sheets.length} were given.`);
  }
  return { ok: true, sheets };
}

function fail(message: string): CompareSelectionResult {
  return { ok: false, issues: [{ field: "sheets", message }] };
}

/** "kestrine/KDX-2G4/B" → its parts; the part number may hold "/" (the first and last segments are the others). */
function parseEntry(entry: string): CompareSheetRef | string {
  const shown = entry.length > 60 ? `${entry.slice(0, 60)}…` : entry;
  const segments = entry.split("/");
  if (segments.length < 3) return `"${shown}" is not a sheet's address: write organization/part/revision, e.g. kestrine/KDX-2G4/B.`;
  const organizationSlug = segments[0];
  const revision = segments[segments.length - 1];
  const partNumber = segments.slice(1, -1).join("/");
  if (!SLUG.test(organizationSlug)) return `"${shown}": "${organizationSlug.slice(0, 40)}" is not an organization's short name (lower-case letters, digits and -).`;
  if (!PART.test(partNumber)) return `"${shown}": "${partNumber.slice(0, 40)}" is not a part number (letters, digits, . _ - /).`;
  if (!REVISION.test(revision)) return `"${shown}": "${revision.slice(0, 20)}" is not a revision (a letter such as B, or current).`;
  return { organizationSlug, partNumber, revision };
}

export function compareSheetKey(ref: CompareSheetRef): string {
  return `${ref.organizationSlug}/${ref.partNumber}/${ref.revision}`;
}

/** The selection as the address keeps it: `sheets=a/b/C,d/e/F`, readable (slashes and commas left as they are). */
export function serializeCompareSelection(sheets: readonly CompareSheetRef[]): string {
  const keep = (s: string) => encodeURIComponent(s).replace(/%2F/g, "/");
  return `sheets=${sheets.map((s) => [s.organizationSlug, s.partNumber, s.revision].map(keep).join("/")).join(",")}`;
}

export function comparePath(sheets: readonly CompareSheetRef[]): string {
  return `/compare?${serializeCompareSelection(sheets)}`;
}

export function compareCsvPath(sheets: readonly CompareSheetRef[]): string {
  return `/api/v1/compare/csv?${serializeCompareSelection(sheets)}`;
}

function toParams(input: Params | Record<string, string | string[] | undefined>): Params {
  if (typeof (input as Params).getAll === "function") return input as Params;
  const record = input as Record<string, string | string[] | undefined>;
  return {
    getAll: (name) => {
      const v = record[name];
      return v === undefined ? [] : Array.isArray(v) ? v : [v];
    },
  };
}
