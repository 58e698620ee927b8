import "server-only";
import { AppError } from "@/lib/errors";
import { uploadFieldsSchema, type UploadFields } from "@/lib/schemas/measurements";
import { formatByteSize } from "@/lib/format";
import { readMultipartFile } from "../multipart-file";

/** Largest measurement file accepted, in bytes (BENCHFOLD_MAX_UPLOAD_BYTES overrides). */
export function maxUploadBytes(): number {
  return Number(process.env.BENCHFOLD_MAX_UPLOAD_BYTES ?? 10 * 1024 * 1024);
}

export type UploadedFile = { name: string; contentType: string; bytes: Uint8Array };

/**
 * Reads a multipart upload: one `file` plus condition fields. The declared length is
 * checked before anything is buffered; the file's real size after.
 */
export async function readUploadForm(
  request: Request,
  extraKeys: readonly string[] = [],
): Promise<{ file: UploadedFile; fields: UploadFields; extra: Record<string, string> }> {
  const limit = maxUploadBytes();
  const { form, file } = await readMultipartFile(request, {
    limitBytes: limit,
    envelopeBytes: 64 * 1024,
    what: "the measurement file",
    limitWords: `the limit is ${formatByteSize(limit)} per file`,
  });
  const raw: Record<string, unknown> = {};
  const extra: Record<string, string> = {};
  for (const [key, value] of form.entries()) {
    if (key === "file" || typeof value !== "string") continue;
    if (extraKeys.includes(key)) {
      extra[key] = value;
      continue;
    }
    if (key === "instrumentIds") raw.instrumentIds = [...((raw.instrumentIds as string[]) ?? []), ...value.split(",").filter(Boolean)];
    else raw[key] = value;
  }
  const fields = uploadFieldsSchema.parse(raw);
  const name = (file.name || "upload").replace(/[\\/]/g, "_").slice(0, 255);
  return { file: { name, contentType: file.type || "application/octet-stream", bytes: new Uint8Array(await file.arrayBuffer()) }, fields, extra };
}
