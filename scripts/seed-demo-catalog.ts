/**
 * The demo catalog (models/seeders/demo-catalog.ts), played through the app's API as people would:
 * the organization's admin enters any instrument it lacks and makes a bench token (revoked at the
 * end); the engineer creates the device; the bench posts the generated files to
 * POST /api/v1/measurements; the reviewer approves them; the engineer reads the draft's statistics,
 * sets limits from them, writes the sheet, submits; the reviewer signs; the engineer releases A.
 * Each part looks at where it stands first (device, sets, revisions), so a second run does nothing
 * and a run cut short carries on.
 */
import type { MeasurementSetSummary } from "../lib/domain/measurements";
import type { SheetModel } from "../lib/sheet";
import { demoCatalogInstruments, demoCatalogIssueReasons, demoCatalogParts, type DemoCatalogPart, type DemoLimitRule } from "../models/seeders/demo-catalog";
import type { DemoInstrument } from "../models/seeders/demo-measurements";
import { demoOrganizations, demoPassword } from "../models/seeders/demo-scenario";
import { DemoApiSession } from "./demo-api-session";
import { approveWaiting, releaseNext, revisionLetters, teams, type Team } from "./seed-demo-releases";

type InstrumentRow = { id: number; kind: string; serial: string };
type Limit = { parameter: string; conditionsKey: string; min?: number; max?: number; unit: string; basis: DemoLimitRule["basis"] };

const instrumentKinds: Record<string, string> = { source: "signal generator", analyzer: "spectrum analyzer", vna: "vector network analyzer" };

function adminOf(appUrl: string, org: string): Promise<DemoApiSession> {
  const admin = demoOrganizations.find((o) => o.slug === org)?.users.find((u) => u.role === "admin");
  if (!admin) throw new Error(`the demo organization ${org} has no admin`);
  return DemoApiSession.signIn(appUrl, { email: admin.email, password: demoPassword });
}

/** The organization's instrument of each kind the parts use, entering the demo's own where it has none. */
async function instrumentIds(admin: DemoApiSession, org: string, keys: Set<string>): Promise<Map<string, number>> {
  const { instruments } = await admin.call<{ instruments: InstrumentRow[] }>("GET", "/api/admin/instruments");
  const ids = new Map<string, number>();
  for (const key of keys) {
    const kind = instrumentKinds[key];
    let found = instruments.find((i) => i.kind === kind);
    if (!found) {
      const wanted: DemoInstrument | undefined = demoCatalogInstruments[org]?.find((i) => i.key === key);
      if (!wanted) throw new Error(`${org} has no ${kind} and the demo catalog enters none`);
      const { key: _key, ...body } = wanted;
      found = (await admin.call<{ instrument: InstrumentRow }>("POST", "/api/admin/instruments", body)).instrument;
    }
    ids.set(key, found.id);
  }
  return ids;
}

/** The device's id, creating it as the engineer does when it is not there yet. */
async function ensureDevice(engineer: DemoApiSession, part: DemoCatalogPart): Promise<number> {
  const { devices } = await engineer.call<{ devices: { id: number; partNumber: string }[] }>("GET", "/api/devices");
  const existing = devices.find((d) => d.partNumber === part.partNumber);
  if (existing) return existing.id;
  const body = { partNumber: part.partNumber, deviceClass: part.deviceClass, title: part.title, description: part.description, keyConditions: part.keyConditions };
  return (await engineer.call<{ device: { id: number } }>("POST", "/api/devices", body)).device.id;
}

/** Posts the part's files that the device does not have yet through the bench API. */
async function uploadMissing(opts: { appUrl: string; token: string; engineer: DemoApiSession; deviceId: number; part: DemoCatalogPart; instruments: Map<string, number> }): Promise<number> {
  const { measurementSets } = await opts.engineer.call<{ measurementSets: MeasurementSetSummary[] }>("GET", `/api/devices/${opts.deviceId}/measurements`);
  const have = new Set(measurementSets.map((s) => s.fileName));
  let uploaded = 0;
  for (const file of opts.part.files()) {
    if (have.has(file.name)) continue;
    const form = new FormData();
    form.set("file", new Blob([file.text]), file.name);
    form.set("device", opts.part.partNumber);
    for (const [k, v] of Object.entries(file.fields)) form.set(k, v);
    form.set("instrumentIds", file.instruments.map((key) => opts.instruments.get(key)).join(","));
    const r = await fetch(`${opts.appUrl}/api/v1/measurements`, { method: "POST", headers: { authorization: `Bearer ${opts.token}` }, body: form });
    const body = (await r.json()) as { error?: { message: string } };
    if (r.status !== 201) throw new Error(`demo catalog upload ${file.name} → ${opts.part.partNumber}: ${r.status} ${body.error?.message}`);
    uploaded++;
  }
  return uploaded;
}

/** Rounds `value` outwards (up for a max, down for a min) to a multiple of `step`, without binary noise. */
function roundOutwards(value: number, step: number, up: boolean): number {
  const steps = up ? Math.ceil(value / step - 1e-9) : Math.floor(value / step + 1e-9);
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9)) + 1;
  return Number((steps * step).toFixed(decimals));
}

/**
 * Limits from the draft's own statistics: for each rule, each condition group of its row gets the
 * mean moved outwards by 4 s and by the stated expanded uncertainty U, rounded outwards.
 */
export function limitsFromStatistics(sheet: SheetModel, part: Pick<DemoCatalogPart, "limits" | "measurementUncertainty" | "partNumber">): Limit[] {
  const limits: Limit[] = [];
  for (const rule of part.limits) {
    const groups = sheet.statistics.groups.filter((g) => g.rowId === rule.row);
    if (groups.length === 0) throw new Error(`${part.partNumber}: the draft has no "${rule.row}" row to set a limit on`);
    for (const g of groups) {
      const mean = g.mean.value;
      const s = g.standardDeviation.value;
      if (mean === null || s === null) throw new Error(`${part.partNumber}: "${rule.row}" at ${g.conditionsKey} has too few units for a limit`);
      const u = part.measurementUncertainty[g.parameter] ?? 0;
      const reach = 4 * s + u;
      const base = { parameter: g.parameter, conditionsKey: g.conditionsKey, unit: g.unit, basis: rule.basis };
      if (rule.side === "max") limits.push({ ...base, max: roundOutwards(mean + reach, rule.step, true) });
      else if (rule.side === "min") limits.push({ ...base, min: roundOutwards(mean - reach, rule.step, false) });
      else {
        const bound = roundOutwards(Math.max(Math.abs(mean + reach), Math.abs(mean - reach)), rule.step, true);
        limits.push({ ...base, min: -bound, max: bound });
      }
    }
  }
  return limits;
}

/** The features line with `{row.side}` replaced by the loosest limit set on that row (what holds across the groups). */
export function fillFeatures(text: string, limits: Limit[], sheet: SheetModel): string {
  return text.replace(/\{([a-z0-9-]+)\.(min|max)\}/g, (whole, row: string, side: "min" | "max") => {
    const keys = new Set(sheet.statistics.groups.filter((g) => g.rowId === row).map((g) => `${g.parameter}|${g.conditionsKey}`));
    const values = limits.filter((l) => keys.has(`${l.parameter}|${l.conditionsKey}`)).map((l) => l[side]).filter((v): v is number => v !== undefined);
    if (values.length === 0) throw new Error(`the features name ${whole}, which has no limit`);
    return String(side === "max" ? Math.max(...values) : Math.min(...values));
  });
}

/** One part from nothing to revision A; what it did, or nothing when it was released already. */
async function playPart(opts: { appUrl: string; team: Team; token: string; instruments: Map<string, number>; part: DemoCatalogPart }): Promise<string | null> {
  const { team, part } = opts;
  const deviceId = await ensureDevice(team.engineer, part);
  if ((await revisionLetters(team.engineer, deviceId)).length > 0) return null;
  await uploadMissing({ ...opts, engineer: team.engineer, deviceId });
  await approveWaiting(team.reviewer, deviceId, () => true);
  const { sheet } = await team.engineer.call<{ sheet: SheetModel }>("GET", `/api/devices/${deviceId}/sheet`);
  const limits = limitsFromStatistics(sheet, part);
  const prose = { ...part.prose, ...(part.prose.features ? { features: fillFeatures(part.prose.features, limits, sheet) } : {}) };
  await team.engineer.call("PUT", `/api/devices/${deviceId}/spec-limits`, { limits }, 200);
  await team.engineer.call("PUT", `/api/devices/${deviceId}/sheet-content`, { prose, absoluteMaximumRatings: part.absoluteMaximumRatings, measurementUncertainty: part.measurementUncertainty }, 200);
  return `${part.partNumber} ${await releaseNext(team, deviceId, { ...part, issueReasons: { ...demoCatalogIssueReasons, ...part.issueReasons } })}`;
}

/** The parts of one organization, one after the other, with one bench token made for the run and revoked after it. */
async function playOrganization(appUrl: string, teamOf: (org: string) => Promise<Team>, org: string, parts: DemoCatalogPart[]): Promise<string[]> {
  const team = await teamOf(org);
  const pending: DemoCatalogPart[] = [];
  for (const part of parts) {
    const { devices } = await team.engineer.call<{ devices: { id: number; partNumber: string }[] }>("GET", "/api/devices");
    const device = devices.find((d) => d.partNumber === part.partNumber);
    if (!device || (await revisionLetters(team.engineer, device.id)).length === 0) pending.push(part);
  }
  if (pending.length === 0) return [];
  const admin = await adminOf(appUrl, org);
  const instruments = await instrumentIds(admin, org, new Set(pending.flatMap((p) => p.files().flatMap((f) => f.instruments))));
  const { token, benchToken } = await admin.call<{ token: string; benchToken: { id: number } }>("POST", "/api/admin/bench-tokens", { name: "Demo catalog loader (revoked after use)" });
  const done: string[] = [];
  try {
    for (const part of pending) {
      const result = await playPart({ appUrl, team, token, instruments, part });
      if (result) done.push(result);
    }
  } finally {
    await admin.call("DELETE", `/api/admin/bench-tokens/${benchToken.id}`, undefined, 200);
  }
  return done;
}

/** Plays whatever part of the demo catalog the database does not show yet; what it released, one line each. */
export async function seedDemoCatalog(appUrl: string): Promise<string[]> {
  const teamOf = teams(appUrl);
  const orgs = [...new Set(demoCatalogParts.map((p) => p.org))];
  // One organization after the other: the releases, which take most of the time, render their PDFs
  // in one worker anyway, and the revisions get the same ids on every fresh database.
  const done: string[] = [];
  for (const org of orgs) done.push(...(await playOrganization(appUrl, teamOf, org, demoCatalogParts.filter((p) => p.org === org))));
  return done;
}
