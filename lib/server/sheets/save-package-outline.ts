import "server-only";
import { createHash } from "node:crypto";
import sharp from "sharp";
import { AppError } from "@/lib/errors";
import { formatByteSize } from "@/lib/format";
import { packageOutlineLimits } from "@/lib/sheet/package-outline";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { lockOwnRow } from "../auth/own-row";
import { readMultipartFile } from "../multipart-file";
import { refreshOpenCandidates } from "../reviews/freshness";
import { findOrCreateSheetContent } from "./save-design-data";
import { storeFile } from "../storage/store-file";
import { outlinePng, type OutlineUpload } from "./outline-png";

export { outlinePng, type OutlineUpload };

/** Reads the multipart upload of a drawing: one `file`, within the size limit (checked before and after buffering). */
export async function readOutlineUpload(request: Request): Promise<OutlineUpload> {
  const limit = packageOutlineLimits.uploadBytes;
  const { file } = await readMultipartFile(request, {
    limitBytes: limit,
    envelopeBytes: 16 * 1024,
    what: "the drawing (SVG or PNG)",
    limitWords: `a package outline may be at most ${formatByteSize(limit)}`,
  });
  if (file.size === 0) throw new AppError("invalid", `${file.name} is empty.`, { field: "file" });
  return { name: file.name || "outline", bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** Stores the drawing (as the PNG the sheet prints) and points the device's sheet at it. */
export async function savePackageOutline(opts: { actor: SessionUser; deviceId: number; upload: OutlineUpload }): Promise<{ sha256: string; widthPx: number; heightPx: number; sizeBytes: number }> {
  const { Device, sequelize } = db();
  const { actor, deviceId, upload } = opts;
  authorize(actor, "sheet-edit");
  const { png, widthPx, heightPx } = outlinePng(upload);
  const sha256 = createHash("sha256").update(png).digest("hex");
  await sequelize.transaction(async (transaction) => {
    await lockOwnRow(Device, deviceId, actor, transaction, "device");
    const content = await findOrCreateSheetContent({ actor, deviceId, transaction });
    const stored = await storeFile(
      { organizationId: actor.organizationId, sha256, originalName: upload.name.replace(/\.svg$/i, ".png").slice(0, 255), contentType: "image/png", bytes: png },
      transaction,
    );
    const before = { packageOutlineFileId: content.packageOutlineFileId ?? null };
    await content.update({ packageOutlineFileId: stored.id, updatedById: actor.id }, { transaction });
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-package-outline.save", subjectType: "device", subjectId: deviceId, before, after: { packageOutlineFileId: stored.id, sha256, widthPx, heightPx, uploadedName: upload.name } },
      transaction,
    );
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
  return { sha256, widthPx, heightPx, sizeBytes: png.byteLength };
}

/** Takes the drawing off the sheet (the stored file stays: a released sheet may print it). */
export async function removePackageOutline(opts: { actor: SessionUser; deviceId: number }): Promise<void> {
  const { Device, sequelize } = db();
  const { actor, deviceId } = opts;
  authorize(actor, "sheet-edit");
  await sequelize.transaction(async (transaction) => {
    await lockOwnRow(Device, deviceId, actor, transaction, "device");
    const content = await findOrCreateSheetContent({ actor, deviceId, transaction });
    const before = { packageOutlineFileId: content.packageOutlineFileId ?? null };
    await content.update({ packageOutlineFileId: null, updatedById: actor.id }, { transaction });
    await recordAuditEvent(
      { organizationId: actor.organizationId, actorUserId: actor.id, action: "sheet-package-outline.remove", subjectType: "device", subjectId: deviceId, before, after: { packageOutlineFileId: null } },
      transaction,
    );
  });
  await refreshOpenCandidates({ organizationId: actor.organizationId, deviceId });
}
