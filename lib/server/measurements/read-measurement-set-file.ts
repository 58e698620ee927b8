import "server-only";
import { QueryTypes } from "sequelize";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import { readStoredFile } from "../storage/store-file";
import type { SessionUser } from "../auth/session-user";

export type MeasurementSetFile = { setId: number; fileName: string; sha256: string; bytes: Buffer };

/**
 * The raw file of one measurement set of the viewer's organization, exactly as uploaded and checked
 * against its recorded SHA-256 (whatever its
 * state: submitted, approved, rejected or superseded). Same resource as the set's page; another
 * organization's set is not found.
 */
export async function readMeasurementSetFile(opts: { viewer: SessionUser; setId: number }): Promise<MeasurementSetFile> {
  const { organizationId } = authorize(opts.viewer, "devices");
  const rows = await db().sequelize.query<{ original_name: string; sha256: string; size_bytes: number; storage_key: string }>(
    `SELECT f.original_name, f.sha256, f.size_bytes, f.storage_key
       FROM measurement_sets ms
       JOIN stored_files f ON f.id = ms.stored_file_id AND f.organization_id = ms.organization_id
      WHERE ms.id = :setId AND ms.organization_id = :organizationId`,
    { type: QueryTypes.SELECT, replacements: { setId: opts.setId, organizationId } },
  );
  const row = rows[0];
  if (!row) throw new AppError("not-found", "No such measurement set in your organization.");
  const bytes = await readStoredFile({ storageKey: row.storage_key, sha256: row.sha256, sizeBytes: row.size_bytes, originalName: row.original_name });
  return { setId: opts.setId, fileName: row.original_name, sha256: row.sha256, bytes };
}
