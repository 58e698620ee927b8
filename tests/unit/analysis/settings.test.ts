import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeWithSettings, AnalysisSettingError, fileAnalysisSettings, resolveAnalysisSettings, tabulateValues } from "@/lib/analysis";
import { isIngestError } from "@/lib/ingest";
import { uploadFieldsSchema } from "@/lib/schemas/measurements";
import { parseMeasurementFile } from "@/lib/ingest";
import { uploadAnalysisSettings } from "@/lib/ingest/upload-conditions";
import { frequencyMultiplierTemplate } from "@/templates";

const ROOT = path.resolve(__dirname, "../../..");
const example = (name: string, edit: (text: string) => string = (t) => t) =>
  parseMeasurementFile({ fileName: name, bytes: new Uint8Array(Buffer.from(edit(readFileSync(path.join(ROOT, "fixtures/examples", name), "utf8")))) });
const withBandLines = (start: string, stop: string) => (text: string) =>
  text.replace("# temperature: 25 C", `# temperature: 25 C\n# integration_start: ${start}\n# integration_stop: ${stop}`);
const noBreak = (text: string) => text.replaceAll("\u00a0", " ");

describe("which source sets the integration band", () => {
  const file = { integrationBandHz: { startHz: 1e3, stopHz: 1e5 } };
  const upload = { integrationBandHz: { startHz: 100, stopHz: 1e6 } };
  const cli = { integrationBandHz: { startHz: 12e3, stopHz: 1e6 } };
  const template = { integrationBandHz: { startHz: 10, stopHz: 1e6 } };
  it.each([
    [{ file, upload, cli, template }, "file", file],
    [{ upload, cli, template }, "upload", upload],
    [{ cli, template }, "cli", cli],
    [{ template }, "template", template],
    [{}, "engine", { integrationBandHz: { startHz: 10, stopHz: 1e6 } }],
  ])("%j → %s", (layers, source, stated) => {
    const { settings } = resolveAnalysisSettings(layers);
    expect(settings.integrationBand).toEqual({ value: stated.integrationBandHz, source });
  });

  it("a lower source that disagrees is named; the template's default never counts as a disagreement", () => {
    const { conflicts } = resolveAnalysisSettings({ file, upload, template });
    expect(conflicts.map(noBreak)).toEqual(["Integration band: the file says 1 kHz – 100 kHz, the upload said 100 Hz – 1 MHz; the file's is used"]);
    expect(resolveAnalysisSettings({ upload, template }).conflicts).toEqual([]);
  });
});

describe("the band on the figures and its refusal", () => {
  it("the file's lines are read and beat the command line", () => {
    const parsed = example("phase-noise-doubler.csv", withBandLines("1 kHz", "100 kHz"));
    const result = analyzeWithSettings(parsed, { cli: { integrationBandHz: { startHz: 12e3, stopHz: 1e6 } } });
    const jitter = result.parameters.find((p) => p.name === "rms-jitter")!;
    expect(jitter.conditions).toMatchObject({ startHz: 1e3, stopHz: 1e5, bandSource: "file" });
  });

  it("a stated band outside the trace is refused with the band and the span; a default is narrowed and said", () => {
    const parsed = example("phase-noise-doubler.csv");
    const refuse = () => analyzeWithSettings(parsed, { upload: { integrationBandHz: { startHz: 12e3, stopHz: 20e6 } } });
    expect(refuse).toThrow(AnalysisSettingError);
    expect(() => refuse()).toThrow(/12\skHz – 20\sMHz \(set by the upload\) reaches outside the trace, which spans 1\sHz – 10\sMHz/);
    const narrowed = analyzeWithSettings(parsed, { template: { integrationBandHz: { startHz: 12e3, stopHz: 20e6 } } });
    expect(narrowed.parameters.find((p) => p.name === "rms-jitter")!.conditions).toMatchObject({ startHz: 12e3, stopHz: 1e7, bandSource: "template" });
    expect(noBreak(narrowed.warnings.join("\n"))).toContain("The integration band 12 kHz – 20 MHz (set by the device class default) reaches outside the trace: narrowed to 12 kHz – 10 MHz");
  });

  it("the multiplier class's default is 10 Hz – 1 MHz", () => {
    expect(frequencyMultiplierTemplate.analysisDefaults?.integrationBandHz).toEqual({ startHz: 10, stopHz: 1e6 });
  });

  it("half a band in the file is refused naming the missing line", () => {
    expect(() => example("phase-noise-doubler.csv", (t) => t.replace("# temperature: 25 C", "# temperature: 25 C\n# integration_start: 1 kHz"))).toThrow(/integration_stop/);
  });
});

describe("the upload's settings", () => {
  it.each([
    [{ integrationBand: "12k-20m" as const }, { integrationBandHz: { startHz: 12e3, stopHz: 20e6 } }],
    [{ integrationStartHz: 10, integrationStopHz: 1e6 }, { integrationBandHz: { startHz: 10, stopHz: 1e6 } }],
    [{ integrationBand: "10-1m" as const, integrationStartHz: 10, integrationStopHz: 1e6 }, { integrationBandHz: { startHz: 10, stopHz: 1e6 } }],
    [{ compressionReferenceDbm: -20 }, { compressionReferenceDbm: -20 }],
    [{}, {}],
  ])("%j", (fields, expected) => {
    expect(uploadAnalysisSettings(fields)).toEqual(expected);
  });

  it.each([
    [{ integrationStartHz: 10 }, "integrationStopHz"],
    [{ integrationStopHz: 10 }, "integrationStartHz"],
    [{ integrationStartHz: 1e6, integrationStopHz: 10 }, "integrationStopHz"],
    [{ integrationBand: "12k-20m" as const, integrationStartHz: 10, integrationStopHz: 1e6 }, "integrationBand"],
  ])("%j is refused at %s", (fields, field) => {
    expect(() => uploadAnalysisSettings(fields)).toThrow(expect.objectContaining({ details: { field } }));
  });
});

describe("the new metadata lines", () => {
  it("two-tone: tone 2's relative level gives both predicted products; the compression reference is the file's", () => {
    const parsed = example("two-tone-mixer.tsv", (t) => t.replace("# kind: two-tone", "# kind: two-tone\n# tone2_relative_level: -3 dB\n# compression_reference: -16 dBm"));
    expect(parsed.kind === "two-tone" && parsed.data.tone2RelativeLevelDb).toBe(-3);
    const result = analyzeWithSettings(parsed, { cli: { compressionReferenceDbm: -12 } });
    expect(result.settings.compressionReferenceDbm).toEqual({ value: -16, source: "file" });
    expect(result.parameters.find((p) => p.name === "input-p1db")!.conditions).toMatchObject({ referenceDbm: -16, referenceSource: "file" });
    const products = result.parameters.filter((p) => p.name === "im3-predicted" && p.conditions.inputPowerDbm === -20);
    expect(products.map((p) => p.conditions.product)).toEqual(["2f1-f2", "2f2-f1"]);
    // P(2f2−f1) − P(2f1−f2) = P2 − P1 = −3 dB.
    expect(products[1].value! - products[0].value!).toBeCloseTo(-3, 12);
  });

  it("drive sweep: the compression reference line is read", () => {
    const parsed = example("drive-sweep-doubler.csv", (t) => t.replace("# kind: drive-sweep", "# kind: drive-sweep\n# compression_reference: 5 dBm"));
    expect(parsed.kind === "drive-sweep" && parsed.data.compressionReferenceDbm).toBe(5);
  });
});

describe("the impedance of power readings (dBm ↔ Vrms ↔ dBµV)", () => {
  it.each([
    [{ file: { impedanceOhm: 75 }, upload: { impedanceOhm: 50 }, cli: { impedanceOhm: 100 } }, 75, "file"],
    [{ upload: { impedanceOhm: 75 }, cli: { impedanceOhm: 100 } }, 75, "upload"],
    [{ cli: { impedanceOhm: 100 } }, 100, "cli"],
    [{}, 50, "engine"],
  ])("%j → %d Ω from %s", (layers, value, source) => {
    expect(resolveAnalysisSettings(layers).settings.impedance).toEqual({ value, source });
  });

  it("a lower source that disagrees is named", () => {
    const { conflicts } = resolveAnalysisSettings({ file: { impedanceOhm: 75 }, upload: { impedanceOhm: 50 } });
    expect(conflicts.map(noBreak)).toEqual(["Impedance: the file says 75 Ω, the upload said 50 Ω; the file's is used"]);
  });

  it("the file's `# impedance:` line is read (with or without its unit) and beats the upload", () => {
    for (const line of ["# impedance: 75", "# impedance: 75 ohm", "# impedance: 75 Ω", "# impedance: 75ohms"]) {
      const parsed = example("two-tone-mixer.tsv", (t) => t.replace("# serial:", `${line}\n# serial:`));
      expect(fileAnalysisSettings(parsed), line).toEqual(expect.objectContaining({ impedanceOhm: 75 }));
      expect(parsed.warnings.join(" ")).not.toContain("impedance");
      expect(analyzeWithSettings(parsed, { upload: { impedanceOhm: 50 } }).settings.impedance).toEqual({ value: 75, source: "file" });
    }
  });

  it.each(["0", "0.5", "-75", "1001 ohm", "fifty", "75 dB"])("`# impedance: %s` is refused naming the line and the field", (value) => {
    let caught: unknown;
    try {
      example("drive-sweep-doubler.csv", (t) => t.replace("# lot:", `# impedance: ${value}\n# lot:`));
    } catch (error) {
      caught = error;
    }
    expect(isIngestError(caught)).toBe(true);
    expect(caught).toMatchObject({ line: 3, field: "impedance" });
    expect((caught as Error).message).toMatch(/impedance/);
  });

  it("a Touchstone file keeps its own reference impedance over the upload's, and says so", () => {
    const parsed = example("attenuator-2port.s2p");
    expect(fileAnalysisSettings(parsed)).toEqual({ impedanceOhm: 50 });
    const result = analyzeWithSettings(parsed, { upload: { impedanceOhm: 75 } });
    expect(result.settings.impedance).toEqual({ value: 50, source: "file" });
    expect(result.warnings.map(noBreak)).toContain("Impedance: the file says 50 Ω, the upload said 75 Ω; the file's is used");
    expect(tabulateValues(parsed, { impedanceOhm: 75, impedanceSource: "upload" })[0]).toMatchObject({ impedanceOhm: 50, impedanceSource: "file" });
  });

  it("0 dBm into 75 Ω is 0.2739 Vrms and 108.75 dBµV in the tables", () => {
    // V = √(P·R) = √(1 mW · 75 Ω) = 0.273861 V; dBµV = 20·log10(V / 1 µV) = 108.7506 (definitions of
    // rms voltage across a resistance and of the dBµV; computed with python3's math module).
    const parsed = example("two-tone-mixer.tsv");
    if (parsed.kind !== "two-tone") throw new Error("not two-tone");
    parsed.data.fundamentalOutputDbm[0] = 0;
    const [table] = tabulateValues(parsed, { impedanceOhm: 75, impedanceSource: "upload" });
    expect(table).toMatchObject({ impedanceOhm: 75, impedanceSource: "upload" });
    const [, dbm, vrms, dbuv] = table.rows[0] as number[];
    expect(dbm).toBe(0);
    expect(vrms).toBeCloseTo(0.2738612788, 9);
    expect(dbuv).toBeCloseTo(108.7506126, 6);
    // Without a stated impedance: 50 Ω, Benchfold's default, 0.2236 Vrms and 106.99 dBµV.
    const [fifty] = tabulateValues(parsed);
    expect(fifty).toMatchObject({ impedanceOhm: 50, impedanceSource: "engine" });
    expect(fifty.rows[0][2]).toBeCloseTo(0.2236067977, 9);
    expect(fifty.rows[0][3]).toBeCloseTo(106.9897000, 6);
  });

  it("the upload's field: 1 to 1000 Ω, refused otherwise naming impedanceOhm", () => {
    expect(uploadAnalysisSettings({ impedanceOhm: 75 })).toEqual({ impedanceOhm: 75 });
    expect(uploadFieldsSchema.parse({ impedanceOhm: "75" }).impedanceOhm).toBe(75);
    for (const bad of ["0", "-75", "1000.5", "1e6", "Infinity", "0x4b", "75 ohm"]) {
      const result = uploadFieldsSchema.safeParse({ impedanceOhm: bad });
      expect(result.success, bad).toBe(false);
      expect(result.error?.issues[0].path, bad).toEqual(["impedanceOhm"]);
    }
  });
});

