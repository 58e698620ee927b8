import "server-only";
import { AppError } from "@/lib/errors";
import { formatByteSize } from "@/lib/format";

/**
 * Reads a multipart body that carries one file in the field `file`: the declared length is checked
 * against the limit (plus the envelope around the file) before anything is buffered, the file's real
 * size after. Every refusal is a 4xx in words that name what to send. Used by the bench upload and
 * the package-outline upload, which differ only in their words and limits.
 */
export async function readMultipartFile(
  request: Request,
  opts: {
    /** Largest file accepted, in bytes. */
    limitBytes: number;
    /** What the multipart envelope may add around the file. */
    envelopeBytes: number;
    /** The file in words: "the measurement file", "the drawing (SVG or PNG)". */
    what: string;
    /** The limit in words, completing "… is 12 MB; ": "the limit is 10 MB per file". */
    limitWords: string;
  },
): Promise<{ form: FormData; file: File }> {
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > opts.limitBytes + opts.envelopeBytes) {
    throw new AppError("payload-too-large", `The upload is ${formatByteSize(declared)}; ${opts.limitWords}.`);
  }
  if (!(request.headers.get("content-type") ?? "").includes("multipart/form-data")) {
    throw new AppError("unsupported-media-type", `Send ${opts.what} as multipart/form-data with a field named "file".`);
  }
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw new AppError("bad-request", "The multipart body could not be read.");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("invalid", `Attach ${opts.what} in a field named "file".`, { field: "file" });
  if (file.size > opts.limitBytes) {
    throw new AppError("payload-too-large", `${file.name} is ${formatByteSize(file.size)}; ${opts.limitWords}.`, { field: "file" });
  }
  return { form, file };
}
