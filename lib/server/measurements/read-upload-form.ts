import "server-only";
import { AppError } from "@/lib/errors";
import { uploadFieldsSchema, type UploadFields } from "@/lib/schemas/measurements";
import { formatByteSize } from "@/lib/format";

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
  const declared = Number(request.headers.get("content-length") ?? NaN);
  // The multipart envelope adds a little around the file.
  if (Number.isFinite(declared) && declared > limit + 64 * 1024) {
    throw new AppError("payload-too-large", `The upload is ${formatByteSize(declared)}; the limit is ${formatByteSize(limit)} per file.`);
  }
  if (!(request.headers.get("content-type") ?? "").includes("multipart/form-data")) {
    throw new AppError("unsupported-media-type", "Send the file as multipart/form-data with a field named \"file\".");
  }
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw new AppError("bad-request", "The multipart body could not be read.");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("invalid", "Attach the measurement file in a field named \"file\".", { field: "file" });
  if (file.size > limit) {
    throw new AppError("payload-too-large", `${file.name} is ${formatByteSize(file.size)}; the limit is ${formatByteSize(limit)} per file.`);
  }
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
