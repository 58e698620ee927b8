/**
 * SHA-256 of a file in the browser without freezing the page: Web Crypto's digest takes the whole
 * file at once and has no streaming form, so a file is read in slices (`Blob.slice().arrayBuffer()`)
 * and fed to @noble/hashes' incremental SHA-256, with a yield to the event loop after each slice so
 * the page keeps drawing and the progress shows. A small file goes to Web Crypto in one piece when
 * the page has it (a secure context). Nothing is uploaded. Pure: Blob exists in browsers and Node.
 */
import { sha256 } from "@noble/hashes/sha2";
import { bytesToHex } from "@noble/hashes/utils";

export const hashChunkBytes = 4 * 1024 * 1024;
/** Up to this size, Web Crypto digests the file in one call (fast, and short enough not to stall the page). */
export const webCryptoMaxBytes = 16 * 1024 * 1024;

export type HashOptions = {
  chunkBytes?: number;
  /** Bytes read so far, after each slice. */
  onProgress?: (doneBytes: number, totalBytes: number) => void;
  signal?: AbortSignal;
  /** Between slices; the default gives the event loop a turn (a macrotask, so input and paint run). */
  yieldToPage?: () => Promise<void>;
  /** Web Crypto's SubtleCrypto, when the caller has one (leave out to always hash incrementally). */
  subtle?: Pick<SubtleCrypto, "digest"> | null;
};

const macrotask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/** The lowercase hex SHA-256 of the blob's bytes. Throws the signal's reason when aborted. */
export async function hashBlob(blob: Blob, options: HashOptions = {}): Promise<string> {
  const { chunkBytes = hashChunkBytes, onProgress, signal, yieldToPage = macrotask, subtle = null } = options;
  if (!(chunkBytes > 0)) throw new Error("chunkBytes must be positive");
  signal?.throwIfAborted();
  if (subtle && blob.size <= webCryptoMaxBytes) {
    const digest = await subtle.digest("SHA-256", await blob.arrayBuffer());
    onProgress?.(blob.size, blob.size);
    return bytesToHex(new Uint8Array(digest));
  }
  const hasher = sha256.create();
  for (let offset = 0; offset < blob.size; offset += chunkBytes) {
    const end = Math.min(blob.size, offset + chunkBytes);
    hasher.update(new Uint8Array(await blob.slice(offset, end).arrayBuffer()));
    onProgress?.(end, blob.size);
    await yieldToPage();
    signal?.throwIfAborted();
  }
  if (blob.size === 0) onProgress?.(0, 0);
  return bytesToHex(hasher.digest());
}
