import "server-only";
import { QueryTypes } from "sequelize";
import { AppError } from "@/lib/errors";
import { db } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";

export type MeasurementSetFile = { setId: number; fileName: string; sha256: string; bytes: Buffer };

/**
 * The raw file of one measurement set of the viewer's organization, exactly as uploaded (whatever its
 * state: submitted, approved, rejected or superseded). Same resource as the set's page; another
 * organization's set is not found.
 */
export async function readMeasurementSetFile(opts: { viewer: SessionUser; setId: number }): Promise<MeasurementSetFile> {
  const { organizationId } = authorize(opts.viewer, "devices");
  const rows = await db().sequelize.query<{ original_name: string; sha256: string; bytes: Buffer }>(
    `SELECT f.original_name, f.sha256, f.bytes
       FROM measurement_sets ms
       JOIN stored_files f ON f.id = ms.stored_file_id AND f.organization_id = ms.organization_id
      WHERE ms.id = :setId AND ms.organization_id = :organizationId`,
    { type: QueryTypes.SELECT, replacements: { setId: opts.setId, organizationId } },
  );
  const row = rows[0];
  if (!row) throw new AppError("not-found", "No such measurement set in your organization.");
  return { setId: opts.setId, fileName: row.original_name, sha256: row.sha256, bytes: Buffer.from(row.bytes) };
}
