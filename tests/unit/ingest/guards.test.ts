import { randomBytes } from "node:crypto";
import { describe, expect, it } from "vitest";
import { IngestError, parseMeasurementFile, parsePhaseNoise, parseTouchstone } from "@/lib/ingest";

const MB = 1024 * 1024;

function caught(f: () => unknown): IngestError {
  try {
    f();
  } catch (e) {
    if (e instanceof IngestError) return e;
    throw e;
  }
  throw new Error("expected an IngestError");
}

function timed<T>(f: () => T): [T, number] {
  const t0 = performance.now();
  const out = f();
  return [out, performance.now() - t0];
}

describe("50 MB of random noise", () => {
  const noise = new Uint8Array(randomBytes(50 * MB));

  it("is refused by the default size limit before any parsing", () => {
    const [err, ms] = timed(() => caught(() => parseMeasurementFile({ fileName: "noise.csv", bytes: noise })));
    expect(err.code).toBe("too-large");
    expect(err.message).toBe(`noise.csv: file is ${50 * MB} bytes, more than the limit of ${20 * MB} bytes`);
    expect(ms).toBeLessThan(50);
  });

  it("is refused as binary with the limit raised, without hanging", () => {
    const [err, ms] = timed(() => caught(() => parseMeasurementFile({ fileName: "noise.s4p", bytes: noise, maxBytes: 100 * MB })));
    expect(err.code).toBe("binary-file");
    expect(err.message).toMatch(/^noise\.s4p line \d+: this is a binary file/);
    expect(ms).toBeLessThan(2000);
  });

  it("printable noise (no NUL, valid UTF-8) is refused as not a table, as CSV or Touchstone, in linear time", () => {
    const printable = new Uint8Array(50 * MB);
    for (let i = 0; i < printable.length; i++) printable[i] = 32 + (noise[i] % 95);
    for (let i = 4096; i < printable.length; i += 4096) printable[i] = 10;
    const [a, msA] = timed(() => caught(() => parseMeasurementFile({ fileName: "noise.csv", bytes: printable, maxBytes: 100 * MB })));
    expect(["unknown-kind", "missing-header"]).toContain(a.code);
    expect(msA).toBeLessThan(5000);
    const [b, msB] = timed(() => caught(() => parseTouchstone("noise.s2p", printable, { maxBytes: 100 * MB })));
    expect(["missing-option-line", "bad-option-line", "bad-keyword", "bad-number", "unsupported-parameter"]).toContain(b.code);
    expect(msB).toBeLessThan(5000);
    const [c, msC] = timed(() => caught(() => parsePhaseNoise("noise.csv", printable, { maxBytes: 100 * MB })));
    expect(c).toBeInstanceOf(IngestError);
    expect(msC).toBeLessThan(5000);
  }, 30_000);
});

describe("adversarial text stays linear", () => {
  it.each([
    ["a 5 MB metadata line", "# serial: " + "x".repeat(5 * MB) + "\n"],
    ["a 5 MB number", "# serial: BFD-1\n# carrier_frequency: 1 GHz\noffset [Hz],L [dBc/Hz]\n1" + "0".repeat(5 * MB) + ",-100\n"],
    ["5 MB of delimiters", "# serial: BFD-1\n# carrier_frequency: 1 GHz\noffset [Hz],L [dBc/Hz]\n" + ",".repeat(5 * MB) + "\n"],
    ["a million empty lines then garbage", "# serial: BFD-1\n# carrier_frequency: 1 GHz\noffset [Hz],L [dBc/Hz]\n" + "\n".repeat(MB) + "x,y\n"],
  ])("%s", (_name, text) => {
    const [err, ms] = timed(() => caught(() => parsePhaseNoise("adversarial.csv", text)));
    expect(err).toBeInstanceOf(IngestError);
    expect(ms).toBeLessThan(2000);
  });

  it("a Touchstone file of 200,000 lines with one '!' at the very end", () => {
    const text = "# Hz S RI R 50\n" + Array.from({ length: 200_000 }, (_, k) => `${k + 1} 0.1 0`).join("\n") + "\n! end\n";
    const [result, ms] = timed(() => parseTouchstone("late-comment.s1p", text));
    expect(result.data.frequencyHz.length).toBe(200_000);
    expect(ms).toBeLessThan(2000);
  });
});
