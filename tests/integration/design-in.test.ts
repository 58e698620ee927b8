import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { readDesignInCurves, type DesignInAnswer, type DesignInCurves } from "@/lib/sheet/design-in";
import type { SheetModel } from "@/lib/sheet/types";
import { closeDb } from "@/models";
import { clientsByRole, makeOrganization } from "./helpers/factories";
import { deviceWithApprovedData, releaseSheet } from "./helpers/reviews";
import reference from "../unit/sheet/reference/design-in-numpy.json";
import { TestClient } from "./helpers/client";

/**
 * `GET /api/v1/sheets/{org}/{part}/{rev}/design-in` and the sheet page's calculator, on the demo's
 * released doubler KDX-2G4 (A, then B) and mixer KM-7H (A), which the demo loader releases before
 * the integration tests (scripts/seed-demo-releases.ts), and its released hybrid KQH-2G.
 */
const anon = new TestClient();

type Answer = { apiVersion: number; revision: { letter: string; standing: string; partNumber: string }; designIn: DesignInAnswer };
type Failure = { error: { code: string; message: string; details?: Record<string, unknown> } };

async function designIn(path: string, query: Record<string, string>): Promise<{ status: number; headers: Headers; body: Answer & Failure }> {
  const r = await anon.request(`/api/v1/sheets/${path}/design-in?${new URLSearchParams(query)}`);
  return { status: r.status, headers: r.headers, body: (await r.json()) as Answer & Failure };
}

// NumPy's figures for the doubler's curves (tests/unit/sheet/reference, scripts/reference/design-in-numpy.py).
// "released": the units each revision was frozen with (the draft has units approved since, see the script).
const numpyAt = (chartId: string, series: string, x: number) =>
  reference.cases.find((c) => c.basis === "released" && c.chartId === chartId && c.series === series && c.x === x)!;

describe("the design-in endpoint", () => {
  it("reads the released doubler's curves at +10 dBm per port, 1 GHz in, as NumPy does", async () => {
    const { status, headers, body } = await designIn("kestrine/KDX-2G4/B", { drive: "+10 dBm", frequency: "1 GHz" });
    expect(status).toBe(200);
    expect(headers.get("cache-control")).toBe("public, no-cache");
    expect(body.apiVersion).toBe(1);
    expect(body.revision).toMatchObject({ letter: "B", partNumber: "KDX-2G4" });
    const answer = body.designIn;
    expect(answer.swept).toMatchObject({ field: "drive", value: 10 });
    expect(answer.fixed).toMatchObject({ field: "frequency", value: 1e9 });
    expect(answer.method).toMatch(/linear in dB against per-port drive in dBm/);
    const loss = answer.readings.find((r) => r.id === "conversion-loss")!;
    const expected = numpyAt("conversion-loss-vs-drive", "2nd harmonic (×2)", 10);
    expect(loss.typical).toBeCloseTo(expected.typical, 8);
    expect(loss.spread.standardDeviation!).toBeCloseTo(expected.standardDeviation, 8);
    // BFD-0001 to BFD-0004 and lot L2410's BFD-0011 and BFD-0012 at 25 °C.
    expect(loss.spread.n).toBe(6);
    expect(loss.limits[0]).toMatchObject({ rowId: "conversion-loss-at-drive", maxText: "11", basis: "test" });
    expect(loss.limits[1]).toMatchObject({ rowId: "conversion-loss-over-temperature", maxText: "11.5", basis: "characterization" });
    const fundamental = answer.readings.find((r) => r.label === "Fundamental suppression")!;
    expect(fundamental.typical).toBeCloseTo(numpyAt("harmonic-suppression-vs-drive", "fundamental (×1)", 10).typical, 8);
  });

  it("reads revision A from A's own frozen curves (three units then), and current as B", async () => {
    const a = await designIn("kestrine/KDX-2G4/A", { drive: "10", frequency: "1000 MHz" });
    expect(a.status).toBe(200);
    expect(a.body.revision).toMatchObject({ letter: "A", standing: "superseded" });
    expect(a.body.designIn.readings[0].spread.n).toBe(3);
    const current = await designIn("kestrine/KDX-2G4/current", { drive: "10", frequency: "1 GHz" });
    const b = await designIn("kestrine/KDX-2G4/B", { drive: "+10 dBm", frequency: "1 GHz" });
    expect(current.body.revision.letter).toBe("B");
    expect(current.body.designIn.readings).toEqual(b.body.designIn.readings);
  });

  it("reads the released mixer along RF frequency at its LO drive, with isolation", async () => {
    const { status, body } = await designIn("kestrine/KM-7H/current", { drive: "+7", frequency: "1.55 GHz" });
    expect(status).toBe(200);
    expect(body.designIn.swept).toMatchObject({ field: "frequency", value: 1.55e9 });
    expect(body.designIn.readings.map((r) => r.id)).toEqual(["conversion-loss", "isolation:LO-RF", "isolation:LO-IF", "isolation:RF-IF"]);
    const loss = body.designIn.readings[0];
    expect(loss.typical).toBeCloseTo(numpyAt("conversion-loss-vs-frequency", "conversion loss", 1.55e9).typical, 8);
    expect(loss.limits.map((l) => l.rowId)).toEqual(["conversion-loss-worst", "conversion-loss-typical", "conversion-loss-worst-over-temperature"]);
  });

  it.each([
    ["a drive that is not a number", "kestrine/KDX-2G4/B", { drive: "ten", frequency: "1 GHz" }, /Drive level: "ten" is not a decimal number/, "issues"],
    ["an unknown unit", "kestrine/KDX-2G4/B", { drive: "10", frequency: "1 furlong" }, /Input frequency: unknown unit/, "issues"],
    ["a frequency without its unit", "kestrine/KDX-2G4/B", { drive: "10", frequency: "1" }, /needs a unit/, "issues"],
    ["ten thousand characters", "kestrine/KDX-2G4/B", { drive: "10", frequency: "9".repeat(10_000) }, /at most 40 characters/, "issues"],
    ["nothing asked", "kestrine/KDX-2G4/B", {}, /Ask with drive/, "issues"],
    ["a drive beyond the sweep", "kestrine/KDX-2G4/B", { drive: "+20 dBm", frequency: "1 GHz" }, /\+20\u00a0dBm is outside the measured range of KDX-2G4, −9\.01\u00a0dBm to \+15\.99\u00a0dBm/, "range"],
    ["another input frequency", "kestrine/KDX-2G4/B", { drive: "10", frequency: "1.2 GHz" }, /measured at input frequency 1\u00a0GHz only; 1\.2\u00a0GHz is outside/, "range"],
    ["a mixer above its band", "kestrine/KM-7H/A", { drive: "7", frequency: "3.5 GHz" }, /RF frequency 3\.5\u00a0GHz is outside the measured range of KM-7H, 0\.5–3\u00a0GHz/, "range"],
    ["a hybrid", "kestrine/KQH-2G/A", { drive: "0", frequency: "2 GHz" }, /reads frequency multiplier and mixer sheets; KQH-2G is a quadrature hybrid/, "device-class"],
  ])("%s is a 422 that says so", async (_what, path, query, message, kind) => {
    const { status, body } = await designIn(path, query);
    expect(status).toBe(422);
    expect(body.error.code).toBe("invalid");
    expect(body.error.message).toMatch(message);
    if (kind === "range") expect(body.error.details).toMatchObject({ reason: "outside-range", range: { text: expect.any(String) } });
    if (kind === "device-class") expect(body.error.details).toMatchObject({ reason: "device-class", field: "sheet" });
    if (kind === "issues") expect(Array.isArray(body.error.details?.issues)).toBe(true);
  });

  it("refuses a field given twice, and answers 404 for a sheet that is not released", async () => {
    const twice = await anon.request("/api/v1/sheets/kestrine/KDX-2G4/B/design-in?drive=10&drive=11&frequency=1%20GHz");
    expect(twice.status).toBe(422);
    expect(((await twice.json()) as Failure).error.message).toBe("Give drive once.");
    expect((await designIn("kestrine/NO-SUCH-PART/A", { drive: "10", frequency: "1 GHz" })).status).toBe(404);
    expect((await designIn("kestrine/KDX-2G4/Z", { drive: "10", frequency: "1 GHz" })).status).toBe(404);
  });
});

describe("the sheet page's calculator", () => {
  it("answers in the page from the query, without JavaScript", async () => {
    const r = await anon.request("/datasheets/kestrine/KDX-2G4/B?drive=%2B10%20dBm&frequency=1%20GHz");
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain('data-testid="design-in-answer"');
    // NumPy reads B's typical curve at 9.5702 dB there (reference/design-in-numpy.json, released).
    expect(html).toMatch(/9\.57(?:<!-- -->)?<\/span>/);
    expect(html).toContain("your design");
    expect(html).toContain('action="/datasheets/kestrine/KDX-2G4/B#design-in"');
    expect(html).not.toContain('data-testid="design-in-standing"');
  });

  it("answers on a superseded revision from its own curves, under the page's superseded notice", async () => {
    const html = await (await anon.request("/datasheets/kestrine/KDX-2G4/A?drive=10&frequency=1%20GHz")).text();
    expect(html).toContain('data-testid="superseded-notice"');
    expect(html).not.toContain('data-testid="design-in-standing"');
    expect(html).toContain('data-testid="design-in-answer"');
  });

  it("says what is wrong with the input, and shows no calculator on a hybrid unless asked", async () => {
    const bad = await (await anon.request("/datasheets/kestrine/KDX-2G4/B?drive=%2B20&frequency=1%20GHz")).text();
    expect(bad).toContain('data-testid="design-in-refusal"');
    expect(bad).toContain("the calculator does not extrapolate");
    const hybrid = await (await anon.request("/datasheets/kestrine/KQH-2G/A")).text();
    expect(hybrid).not.toContain('data-testid="design-in"');
    const askedHybrid = await (await anon.request("/datasheets/kestrine/KQH-2G/A?drive=0&frequency=2%20GHz")).text();
    expect(askedHybrid).toContain('data-testid="design-in-unavailable"');
  });
});

describe("a released one-unit doubler, then withdrawn", () => {
  let revision: RevisionSummary;
  let curves: DesignInCurves;
  afterAll(() => closeDb());
  beforeAll(async () => {
    const org = await makeOrganization();
    const clients = await clientsByRole(org);
    const engineer = clients.get("engineer")!;
    const reviewer = clients.get("reviewer")!;
    const deviceId = await deviceWithApprovedData(org.organization.id, engineer, reviewer);
    revision = await releaseSheet(engineer, reviewer, deviceId, "First lot.");
    const sheet = ((await (await anon.request(`/api/v1${revision.publicPath.replace("/datasheets", "/sheets")}`)).json()) as { sheet: SheetModel }).sheet;
    const read = readDesignInCurves(sheet);
    if (!read.ok) throw new Error(read.message);
    curves = read.curves;
    const withdrawn = await reviewer.request(`/api/sheet-revisions/${revision.id}/withdraw`, { json: { reason: "Wrong fixture loss applied." } });
    expect(withdrawn.status, await withdrawn.clone().text()).toBe(200);
  });

  it("answers from the frozen curves with one unit's spread, and says the revision is withdrawn", async () => {
    const drive = `${(curves.range.min + curves.range.max) / 2} dBm`;
    const frequency = `${curves.fixed.value} Hz`;
    const path = revision.publicPath.replace("/datasheets/", "");
    const { status, body } = await designIn(path, { drive, frequency });
    expect(status).toBe(200);
    expect(body.revision.standing).toBe("withdrawn");
    expect(body.designIn.readings[0].spread).toMatchObject({ n: 1, standardDeviation: null });
    const html = await (await anon.request(`${revision.publicPath}?${new URLSearchParams({ drive, frequency })}`)).text();
    expect(html).toContain('data-testid="design-in-standing"');
    expect(html).toContain("is withdrawn (Wrong fixture loss applied)");
    expect(html).toContain("one unit");
  });
});
