import { createHash, webcrypto } from "node:crypto";
import { describe, expect, it } from "vitest";
import { hashBlob } from "@/lib/verify/hash-blob";

// FIPS 180-2, Appendix B.1 and B.2 (the "abc" and two-block message examples), and the empty message.
const vectors = [
  ["", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"],
  ["abc", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"],
  ["abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq", "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1"],
] as const;

describe("hashBlob", () => {
  it.each(vectors)("FIPS 180-2 vector %j, in slices of 1, 7 and 64 bytes and through Web Crypto", async (text, hex) => {
    for (const chunkBytes of [1, 7, 64]) {
      expect(await hashBlob(new Blob([text]), { chunkBytes, yieldToPage: async () => {} })).toBe(hex);
    }
    expect(await hashBlob(new Blob([text]), { subtle: webcrypto.subtle })).toBe(hex);
  });

  it("hashes a file of many slices like node:crypto, yielding to the page after every slice and reporting progress", async () => {
    const bytes = new Uint8Array(10 * 1024 * 1024 + 123);
    for (let i = 0; i < bytes.length; i++) bytes[i] = (i * 2654435761) >>> 24;
    const progress: number[] = [];
    let yields = 0;
    const hex = await hashBlob(new Blob([bytes]), {
      chunkBytes: 1024 * 1024,
      onProgress: (done) => progress.push(done),
      yieldToPage: async () => {
        yields++;
      },
    });
    expect(hex).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(yields).toBe(11);
    expect(progress).toHaveLength(11);
    expect(progress.at(-1)).toBe(bytes.length);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
  });

  it("leaves a file over the Web Crypto size to the incremental hash, and stops when aborted", async () => {
    const big = new Blob([new Uint8Array(17 * 1024 * 1024)]);
    const subtle = { digest: () => Promise.reject(new Error("must not be called for a big file")) };
    const controller = new AbortController();
    let slices = 0;
    await expect(
      hashBlob(big, {
        subtle,
        onProgress: () => {
          if (++slices === 2) controller.abort(new Error("dropped another file"));
        },
        signal: controller.signal,
        yieldToPage: async () => {},
      }),
    ).rejects.toThrow("dropped another file");
    expect(slices).toBe(2);
  });
});
