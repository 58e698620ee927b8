import "server-only";
import { createHash } from "node:crypto";
import { QueryTypes } from "sequelize";
import { specificationsCsv } from "@/lib/catalog/sheet-csv";
import { datasheetPdfPath } from "@/lib/domain/reviews";
import { AppError } from "@/lib/errors";
import { parseTouchstone } from "@/lib/ingest";
import { writeTouchstone } from "@/lib/ingest/touchstone/write-touchstone";
import { medianNetwork } from "@/lib/rf/median-network";
import type { SheetModel } from "@/lib/sheet";
import { medianTouchstoneFileName, specificationsCsvFileName, touchstoneFileNames, touchstoneGroupId } from "@/lib/sheet/file-name";
import { db } from "@/models";
import { KeptResults } from "../kept-results";
import { readStoredFile } from "../storage/store-file";
import { locateReleasedRevision, type ReleasedRevisionHead, type ReleasedSheet } from "./list-revisions";

/** One Touchstone file behind a released revision: its set, the name it is downloaded under, and where. */
export type ReleasedTouchstoneFile = {
  setId: number;
  serial: string;
  temperature: string;
  portCount: number;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  /** The lettered download address (never "current": the file is the revision's, not the part's). */
  path: string;
};

/** The median unit of the released Touchstone sets of one condition (temperature and port count). */
export type ReleasedMedianTouchstone = {
  groupId: string;
  temperature: string;
  portCount: number;
  serials: string[];
  setIds: number[];
  fileName: string;
  path: string;
};

type Row = { id: number; sha256: string; size_bytes: number; port_count: string | number | null };
type ListedSet = { id: string; serial: string; temperature: string };

/** What the downloads of one released revision take from its frozen model: read once per revision and kept (the model never changes). */
type DownloadBasis = { deviceId: number; partNumber: string; letter: string; basePath: string; sets: ListedSet[]; csv: { text: string; etag: string; fileName: string } };

const bases = new KeptResults<DownloadBasis>(32);
const medians = new KeptResults<{ text: string; sha256: string }>(16);

function basisOf(model: SheetModel, at: { deviceId: number; letter: string; basePath: string }): DownloadBasis {
  const text = specificationsCsv(model);
  return {
    ...at,
    partNumber: model.header.partNumber,
    sets: model.traceability.measurementSets.filter((s) => s.kind === "touchstone").map(({ id, serial, temperature }) => ({ id, serial, temperature })),
    csv: { text, etag: `"${createHash("sha256").update(text).digest("hex")}"`, fileName: specificationsCsvFileName(model.header.partNumber, at.letter) },
  };
}

async function downloadBasis(head: ReleasedRevisionHead, address: { organizationSlug: string; partNumber: string }): Promise<DownloadBasis> {
  return bases.get(String(head.id), async () => {
    const row = await db().SheetRevision.unscoped().findByPk(head.id, { attributes: ["modelJson"] });
    if (!row) throw new AppError("not-found", "No such released sheet.");
    const basePath = datasheetPdfPath(address.organizationSlug, address.partNumber, head.letter).replace(/\/pdf$/, "");
    return basisOf(JSON.parse(row.modelJson) as SheetModel, { deviceId: head.deviceId, letter: head.letter, basePath });
  });
}

/**
 * The Touchstone sets a released revision rests on: exactly those its frozen model lists in its
 * traceability (kind "touchstone"), and only where that set is still the revision's device's own
 * approved set, so a live or foreign set can never be reached through a revision's address.
 */
async function touchstoneFiles(basis: Pick<DownloadBasis, "deviceId" | "partNumber" | "letter" | "basePath" | "sets">): Promise<ReleasedTouchstoneFile[]> {
  const ids = basis.sets.map((s) => Number(s.id)).filter((id) => Number.isSafeInteger(id) && id > 0);
  if (!ids.length) return [];
  const rows = await db().sequelize.query<Row>(
    `SELECT ms.id, f.sha256, f.size_bytes, JSON_VALUE(ms.parsed, '$.portCount') AS port_count
       FROM measurement_sets ms
       JOIN stored_files f ON f.id = ms.stored_file_id AND f.organization_id = ms.organization_id
      WHERE ms.id IN (:ids) AND ms.device_id = :deviceId AND ms.kind = 'touchstone' AND ms.state = 'approved'`,
    { type: QueryTypes.SELECT, replacements: { ids, deviceId: basis.deviceId } },
  );
  const byId = new Map(rows.map((r) => [Number(r.id), r]));
  const present = basis.sets.filter((s) => byId.has(Number(s.id)));
  const entries = present.map((s) => ({ setId: s.id, serial: s.serial, temperature: s.temperature, portCount: Number(byId.get(Number(s.id))!.port_count) || 2 }));
  const names = touchstoneFileNames({ partNumber: basis.partNumber, letter: basis.letter, sets: entries });
  return entries.map((e) => {
    const row = byId.get(Number(e.setId))!;
    return {
      setId: Number(e.setId),
      serial: e.serial,
      temperature: e.temperature,
      portCount: e.portCount,
      fileName: names.get(e.setId)!,
      sizeBytes: Number(row.size_bytes),
      sha256: row.sha256,
      path: `${basis.basePath}/touchstone/${e.setId}`,
    };
  });
}

/** The released revision's Touchstone files, for its public page (which has read the model already). */
export async function listReleasedTouchstone(released: ReleasedSheet): Promise<ReleasedTouchstoneFile[]> {
  return touchstoneFiles({
    deviceId: released.summary.deviceId,
    partNumber: released.model.header.partNumber,
    letter: released.summary.letter,
    basePath: released.summary.pdfPath.replace(/\/pdf$/, ""),
    sets: released.model.traceability.measurementSets.filter((s) => s.kind === "touchstone"),
  });
}

/**
 * The merged files a designer takes away: per condition (temperature, port count) with two or more
 * units, the median unit (lib/rf/median-network.ts); each unit counts once, by its latest set.
 */
export function medianTouchstoneGroups(files: ReleasedTouchstoneFile[], at: { partNumber: string; letter: string; basePath: string }): ReleasedMedianTouchstone[] {
  const groups = new Map<string, ReleasedTouchstoneFile[]>();
  for (const f of files) {
    const id = touchstoneGroupId(f.temperature, f.portCount);
    groups.set(id, [...(groups.get(id) ?? []), f]);
  }
  const out: ReleasedMedianTouchstone[] = [];
  for (const [groupId, members] of groups) {
    const latest = new Map<string, ReleasedTouchstoneFile>();
    for (const f of [...members].sort((a, b) => a.setId - b.setId)) latest.set(f.serial, f);
    if (latest.size < 2) continue;
    const units = [...latest.values()].sort((a, b) => a.setId - b.setId);
    const { temperature, portCount } = units[0];
    out.push({
      groupId,
      temperature,
      portCount,
      serials: units.map((u) => u.serial),
      setIds: units.map((u) => u.setId),
      fileName: medianTouchstoneFileName({ partNumber: at.partNumber, letter: at.letter, unitCount: units.length, temperature, portCount }),
      path: `${at.basePath}/touchstone/median/${groupId}`,
    });
  }
  return out.sort((a, b) => a.groupId.localeCompare(b.groupId));
}

type Address = { organizationSlug: string; partNumber: string; revision: string };
type Released = { head: ReleasedRevisionHead; basis: DownloadBasis };

async function locate(address: Address): Promise<Released> {
  const head = await locateReleasedRevision(address);
  return { head, basis: await downloadBasis(head, address) };
}

/** A released revision's specification table as CSV, made once per revision from its frozen model. */
export async function readReleasedCsv(address: Address): Promise<Released & { csv: DownloadBasis["csv"] }> {
  const released = await locate(address);
  return { ...released, csv: released.basis.csv };
}

export type ReleasedTouchstoneDownload = { head: ReleasedRevisionHead; file: ReleasedTouchstoneFile; bytes: Buffer };

/**
 * The raw bytes, exactly as uploaded, of one Touchstone set behind a released revision by its public
 * address. A set the revision does not rest on answers the same 404 as an unknown one.
 */
export async function readReleasedTouchstone(opts: Address & { setId: number }): Promise<ReleasedTouchstoneDownload> {
  const { head, basis } = await locate(opts);
  if (!basis.sets.some((s) => Number(s.id) === opts.setId)) throw new AppError("not-found", "No such Touchstone file behind this released sheet.");
  // All of the revision's sets are listed (one query): a name depends on whether another set would share it.
  const file = (await touchstoneFiles(basis)).find((f) => f.setId === opts.setId);
  if (!file) throw new AppError("not-found", "No such Touchstone file behind this released sheet.");
  return { head, file, bytes: await readSetBytes(file.setId) };
}

/** The median unit of one condition's released Touchstone sets, written by the engine (Touchstone 1.1, dB and degrees). */
export async function readReleasedMedianTouchstone(opts: Address & { groupId: string }): Promise<{ head: ReleasedRevisionHead; group: ReleasedMedianTouchstone; text: string; sha256: string }> {
  const { head, basis } = await locate(opts);
  const group = medianTouchstoneGroups(await touchstoneFiles(basis), basis).find((g) => g.groupId === opts.groupId);
  if (!group) throw new AppError("not-found", "No merged Touchstone file for this condition behind this released sheet.");
  const made = await medians.get(`${head.id}:${group.setIds.join(",")}`, async () => {
    const units = await Promise.all(group.setIds.map(async (id) => parseTouchstone(`set-${id}.s${group.portCount}p`, await readSetBytes(id)).data));
    const references = new Set(units.flatMap((u) => u.referenceOhm));
    if (references.size !== 1) throw new AppError("conflict", `The units of ${group.temperature || "this condition"} are referred to different impedances (${[...references].join(", ")} Ω): no median can be taken.`);
    const comments = [
      `Benchfold: median unit of ${basis.partNumber} Rev. ${basis.letter}${group.temperature ? ` at ${group.temperature}` : ""}, ${group.serials.length} units (${group.serials.join(", ")}).`,
      "At each frequency and for each S(i,j): the median across units of |S| in dB and of the phase unwrapped along frequency.",
      `Measurement sets ${group.setIds.map((id) => `#${id}`).join(", ")}; each unit's own file is on the sheet's page.`,
    ];
    const text = writeTouchstone({ ...medianNetwork(units), referenceOhm: [...references][0] }, comments);
    return { text, sha256: createHash("sha256").update(text).digest("hex") };
  });
  return { head, group, ...made };
}

/** A stored set's raw bytes, checked against their SHA-256; the caller has decided the set may be read. */
export async function readSetBytes(setId: number): Promise<Buffer> {
  const rows = await db().sequelize.query<{ original_name: string; sha256: string; size_bytes: number; storage_key: string }>(
    `SELECT f.original_name, f.sha256, f.size_bytes, f.storage_key FROM measurement_sets ms JOIN stored_files f ON f.id = ms.stored_file_id WHERE ms.id = :setId`,
    { type: QueryTypes.SELECT, replacements: { setId } },
  );
  const row = rows[0];
  if (!row) throw new AppError("not-found", "No such measurement set.");
  return readStoredFile({ storageKey: row.storage_key, sha256: row.sha256, sizeBytes: row.size_bytes, originalName: row.original_name });
}
