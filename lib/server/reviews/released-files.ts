import "server-only";
import { QueryTypes } from "sequelize";
import { AppError } from "@/lib/errors";
import { touchstoneFileNames } from "@/lib/sheet/file-name";
import { db } from "@/models";
import { readStoredFile } from "../storage/store-file";
import { findReleasedRevision, type ReleasedSheet } from "./list-revisions";

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

type Row = { id: number; sha256: string; size_bytes: number; port_count: string | number | null };

/**
 * The Touchstone sets a released revision rests on: exactly those its frozen model lists in its
 * traceability (kind "touchstone"), and only where that set is still the revision's device's own
 * approved set, so a live or foreign set can never be reached through a revision's address.
 */
export async function listReleasedTouchstone(released: ReleasedSheet): Promise<ReleasedTouchstoneFile[]> {
  const listed = released.model.traceability.measurementSets.filter((s) => s.kind === "touchstone");
  const ids = listed.map((s) => Number(s.id)).filter((id) => Number.isSafeInteger(id) && id > 0);
  if (!ids.length) return [];
  const rows = await db().sequelize.query<Row>(
    `SELECT ms.id, f.sha256, f.size_bytes, JSON_VALUE(ms.parsed, '$.portCount') AS port_count
       FROM measurement_sets ms
       JOIN stored_files f ON f.id = ms.stored_file_id AND f.organization_id = ms.organization_id
      WHERE ms.id IN (:ids) AND ms.device_id = :deviceId AND ms.kind = 'touchstone' AND ms.state = 'approved'`,
    { type: QueryTypes.SELECT, replacements: { ids, deviceId: released.summary.deviceId } },
  );
  const byId = new Map(rows.map((r) => [Number(r.id), r]));
  const present = listed.filter((s) => byId.has(Number(s.id)));
  const entries = present.map((s) => ({ setId: s.id, serial: s.serial, temperature: s.temperature, portCount: Number(byId.get(Number(s.id))!.port_count) || 2 }));
  const names = touchstoneFileNames({ partNumber: released.model.header.partNumber, letter: released.summary.letter, sets: entries });
  const base = released.summary.pdfPath.replace(/\/pdf$/, "");
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
      path: `${base}/touchstone/${e.setId}`,
    };
  });
}

export type ReleasedTouchstoneDownload = { released: ReleasedSheet; file: ReleasedTouchstoneFile; bytes: Buffer };

/**
 * The raw bytes, exactly as uploaded, of one Touchstone set behind a released revision by its public
 * address. A set the revision does not rest on answers the same 404 as an unknown one.
 */
export async function readReleasedTouchstone(opts: { organizationSlug: string; partNumber: string; revision: string; setId: number }): Promise<ReleasedTouchstoneDownload> {
  const released = await findReleasedRevision(opts);
  const file = (await listReleasedTouchstone(released)).find((f) => f.setId === opts.setId);
  if (!file) throw new AppError("not-found", "No such Touchstone file behind this released sheet.");
  const bytes = await readSetBytes(file.setId);
  return { released, file, bytes };
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
