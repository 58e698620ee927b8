import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CandidateDetail, CandidateSummary, RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { closeDb, db } from "@/models";
import type { CatalogResult } from "@/lib/catalog/types";
import { deviceClasses } from "@/lib/domain/device-classes";
import { demoCatalogIssueReasons, demoCatalogParts } from "@/models/seeders/demo-catalog";
import { demoChangesRequested, demoDoublerStory, demoOpenReview } from "@/models/seeders/demo-releases";
import { demoOrganizations, demoPassword } from "@/models/seeders/demo-scenario";
import type { SubscriptionsPage } from "@/lib/domain/subscriptions";
import { TestClient } from "./helpers/client";
import { mailsTo, type CaughtMail } from "./helpers/mailbox";

/**
 * What the demo loader (scripts/seed-demo-releases.ts, run before the integration tests) leaves:
 * read over HTTP as the demo's own people see it.
 */
const signedIn = new Map<string, TestClient>();
afterAll(() => closeDb());

async function person(org: string, role: "engineer" | "reviewer"): Promise<TestClient> {
  const key = `${org}/${role}`;
  if (!signedIn.has(key)) {
    const email = demoOrganizations.find((o) => o.slug === org)!.users.find((u) => u.role === role)!.email;
    const client = new TestClient();
    expect((await client.signIn(email, demoPassword)).ok).toBe(true);
    signedIn.set(key, client);
  }
  return signedIn.get(key)!;
}

async function getJson<T>(client: TestClient, path: string): Promise<T> {
  const r = await client.request(path);
  expect(r.status, path).toBe(200);
  return (await r.json()) as T;
}

async function deviceId(org: string, part: string): Promise<number> {
  const { devices } = await getJson<{ devices: { id: number; partNumber: string }[] }>(await person(org, "engineer"), "/api/devices");
  return devices.find((d) => d.partNumber === part)!.id;
}

async function revisions(org: string, part: string): Promise<RevisionSummary[]> {
  return (await getJson<{ revisions: RevisionSummary[] }>(await person(org, "engineer"), `/api/devices/${await deviceId(org, part)}/revisions`)).revisions;
}

async function review(org: string, part: string): Promise<{ open: CandidateSummary | null; latest: CandidateSummary | null }> {
  return getJson(await person(org, "engineer"), `/api/devices/${await deviceId(org, part)}/review`);
}

describe("the demo's releases", () => {
  let doubler: RevisionSummary[];
  beforeAll(async () => {
    doubler = await revisions("kestrine", "KDX-2G4");
  });

  it("show the Kestrine KDX-2G4 as revision B (current) over A (superseded), each signed by the demo reviewer", () => {
    expect(doubler.map((r) => [r.letter, r.standing])).toEqual([
      ["B", "current"],
      ["A", "superseded"],
    ]);
    for (const r of doubler) {
      expect(r.signers.map((s) => s.name)).toEqual(["Hiroshi Tanabe"]);
      expect(r.releasedBy.name).toBe("Elena Marchetti");
    }
    expect(doubler[0].notes.at(-1)).toBe(demoDoublerStory.revisionB.releaseNote);
    // B's generated notes (the diff against A) name the tightened limit and the added unit.
    expect(doubler[0].notes.some((n) => /^Conversion loss.*11\.5\sdB → 11\sdB/.test(n)), doubler[0].notes.join(" | ")).toBe(true);
    expect(doubler[0].notes.some((n) => n.includes("BFD-0004"))).toBe(true);
    // …and the evaluation board added to the ordering information (the design-in diff), nothing else of the design-in sections.
    expect(doubler[0].notes.filter((n) => /Ordering information|Pin functions|operating conditions|Package outline/.test(n))).toEqual([
      "Added: Ordering information, KDX-2G4-EB: Evaluation board with the in-phase splitter fitted · Single board, anti-static bag",
    ]);
    expect(doubler[1].notes).toEqual(["First release.", demoDoublerStory.revisionA.releaseNote]);
  });

  it("serve A and B as different stored PDFs whose bytes match their SHA-256, to anyone", async () => {
    const anonymous = new TestClient();
    for (const r of doubler) {
      const pdf = await anonymous.request(r.pdfPath);
      expect(pdf.status).toBe(200);
      const bytes = Buffer.from(await pdf.arrayBuffer());
      expect(createHash("sha256").update(bytes).digest("hex")).toBe(r.pdfSha256);
    }
    expect(doubler[0].pdfSha256).not.toBe(doubler[1].pdfSha256);
  });

  it("tightened the conversion-loss maximum from 11.5 dB at A to 11.0 dB at B, and B counts the fourth unit and the second lot", async () => {
    const { SheetRevision } = db();
    // The frozen models, read from MariaDB: what each revision's page and PDF were made from.
    const models = await Promise.all(doubler.map(async (r) => JSON.parse((await SheetRevision.unscoped().findByPk(r.id, { attributes: ["modelJson"] }))!.modelJson) as SheetModel));
    const conversionLoss = (m: (typeof models)[number]) => m.statistics.groups.find((g) => g.rowId === "conversion-loss-at-drive" && g.conditionsKey === "drive=10;inputFrequencyHz=1000000000;temperatureC=25")!;
    const [b, a] = models.map(conversionLoss);
    expect([a.limits?.max.value, b.limits?.max.value]).toEqual([11.5, 11]);
    // B: BFD-0004 and lot L2410's two units at 25 °C.
    expect([a.n, b.n]).toEqual([3, 6]);
    // B also guarantees the maximum over −40 to +85 °C, from the four units run at −40, +25 and +85 °C (both lots; the
    // units measured at 25 °C alone are in the 25 °C rows); A had no runs over temperature.
    const overTemperature = (m: (typeof models)[number]) => m.statistics.groups.find((g) => g.rowId === "conversion-loss-over-temperature");
    expect(overTemperature(models[1])).toBeUndefined();
    expect(overTemperature(models[0])).toMatchObject({ conditionsKey: "drive=10;inputFrequencyHz=1000000000;temperatureMaxC=85;temperatureMinC=-40", n: 4, lots: 2 });
    expect(overTemperature(models[0])!.limits?.max.value).toBe(11.5);
    expect(overTemperature(models[0])!.supported).toBe(true);
  });

  it("froze the design-in sections into every demo release: the outline as the PNG the server drew from the demo's SVG, the same drawing at A and B", async () => {
    const { SheetRevision } = db();
    const frozen = async (org: string, part: string) =>
      Promise.all((await revisions(org, part)).map(async (r) => JSON.parse((await SheetRevision.unscoped().findByPk(r.id, { attributes: ["modelJson"] }))!.modelJson) as SheetModel));
    const [b, a] = await frozen("kestrine", "KDX-2G4");
    expect(a.designData!.ordering.map((o) => o.partNumber)).toEqual(["KDX-2G4-TR1", "KDX-2G4-CT"]);
    expect(b.designData!.ordering.map((o) => o.partNumber)).toEqual(["KDX-2G4-TR1", "KDX-2G4-CT", "KDX-2G4-EB"]);
    expect(b.designData!.packageOutline!.sha256).toBe(a.designData!.packageOutline!.sha256);
    for (const part of ["KM-7H", "KQH-2G"]) {
      const [model] = await frozen("kestrine", part);
      const data = model.designData!;
      expect(data.pinFunctions.length, part).toBeGreaterThan(3);
      expect(data.recommendedOperatingConditions.map((c) => c.parameter), part).toContain("Ambient temperature");
      const png = Buffer.from(data.packageOutline!.dataUri.replace(/^data:image\/png;base64,/, ""), "base64");
      expect(createHash("sha256").update(png).digest("hex"), part).toBe(data.packageOutline!.sha256);
      expect(png.subarray(1, 4).toString("latin1"), part).toBe("PNG");
    }
  });

  it("released the mixer, the hybrid and the Pellacourt splitter as revision A", async () => {
    for (const [org, part] of [
      ["kestrine", "KM-7H"],
      ["kestrine", "KQH-2G"],
      ["pellacourt", "PS-2W"],
    ]) {
      expect((await revisions(org, part)).map((r) => [r.letter, r.standing]), part).toEqual([["A", "current"]]);
    }
  });

  it("leaves one sheet in review with the reviewer's comment on a spec row and the engineer's reply", async () => {
    const { open } = await review(demoOpenReview.org, demoOpenReview.part);
    expect(open?.state).toBe("in-review");
    const { candidate } = await getJson<{ candidate: CandidateDetail }>(await person(demoOpenReview.org, "reviewer"), `/api/sheet-candidates/${open!.id}`);
    const [first, reply] = candidate.comments;
    expect(candidate.comments).toHaveLength(2);
    expect(first).toMatchObject({ parentId: null, body: demoOpenReview.comment.body, author: { name: "Priya Raman" }, anchor: { kind: "row" } });
    expect(first.anchor.label).toMatch(/^Conversion loss/);
    expect(reply).toMatchObject({ parentId: first.id, body: demoOpenReview.reply, author: { name: "Tomas Lindqvist" }, anchor: first.anchor });
    expect(await revisions(demoOpenReview.org, demoOpenReview.part)).toEqual([]);
  });

  it("leaves one sheet sent back with the reviewer's reason", async () => {
    const { open } = await review(demoChangesRequested.org, demoChangesRequested.part);
    expect(open).toMatchObject({ state: "changes-requested", changeRequest: demoChangesRequested.reason });
    const { candidate } = await getJson<{ candidate: CandidateDetail }>(await person(demoChangesRequested.org, "engineer"), `/api/sheet-candidates/${open!.id}`);
    expect(candidate.acknowledgements.map((a) => a.code)).toEqual(["no-approved-data"]);
    expect(candidate.acknowledgements[0].reason.length).toBeGreaterThan(40);
  });
});

describe("the demo catalog", () => {
  const demoOrgs = ["kestrine", "pellacourt", "wrenfield-lab"];

  it("holds at least twelve released demo parts, current, across the three classes, from both vendors and the lab", async () => {
    const anonymous = new TestClient();
    const demoHits: CatalogResult["hits"] = [];
    for (const org of demoOrgs) {
      const result = await getJson<CatalogResult>(anonymous, `/api/v1/sheets?org=${org}&limit=100`);
      demoHits.push(...result.hits);
    }
    expect(demoHits.length).toBeGreaterThanOrEqual(12);
    for (const deviceClass of deviceClasses.filter((c) => c !== "comb-generator-test-only")) {
      expect(demoHits.filter((h) => h.deviceClass === deviceClass).length, deviceClass).toBeGreaterThanOrEqual(3);
    }
    for (const org of demoOrgs) expect(demoHits.filter((h) => h.organization.slug === org).length, org).toBeGreaterThanOrEqual(3);
    for (const part of demoCatalogParts) {
      expect(demoHits.find((h) => h.partNumber === part.partNumber)?.letter, part.partNumber).toBe("A");
    }
  });

  it("released each catalog part with limits its own units support, and features that promise what the table guarantees", async () => {
    const { SheetRevision, Device } = db();
    for (const part of demoCatalogParts) {
      const device = await Device.findOne({ where: { partNumber: part.partNumber }, attributes: ["id"] });
      const revision = await SheetRevision.unscoped().findOne({ where: { deviceId: device!.id, letter: "A" }, attributes: ["modelJson"] });
      const model = JSON.parse(revision!.modelJson) as SheetModel;
      const limited = model.statistics.groups.filter((g) => g.limits && (g.limits.min.value !== null || g.limits.max.value !== null));
      // Every rule of the part set a limit on each of its row's groups, from three or more units.
      expect(new Set(limited.map((g) => g.rowId)), part.partNumber).toEqual(new Set(part.limits.map((l) => l.row)));
      for (const g of limited) {
        expect(g.n, `${part.partNumber} ${g.groupId}`).toBeGreaterThanOrEqual(3);
        expect([g.supported, g.failCount], `${part.partNumber} ${g.groupId}`).toEqual([true, 0]);
      }
      // Released with only the issues the loader gives its engineers' reason for (the consistency checks' findings).
      expect(model.issues.filter((i) => !demoCatalogIssueReasons[i.code]), part.partNumber).toEqual([]);
      // The features line names a limit the table states (e.g. "below 12.5 dB" beside a 12.5 dB max).
      const features = model.prose.find((p) => p.id === "features");
      const promised = [...(JSON.stringify(features) ?? "").matchAll(/(?:below|above|within ±)\s?(\d+(?:\.\d+)?)/g)].map((m) => Number(m[1]));
      expect(promised.length, part.partNumber).toBeGreaterThan(0);
      const stated = limited.flatMap((g) => [g.limits!.min.value, g.limits!.max.value]).filter((v): v is number => v !== null).map(Math.abs);
      for (const value of promised) expect(stated, `${part.partNumber} promises ${value}`).toContain(value);
    }
  });
});

describe("the demo customer", () => {
  const customer = demoDoublerStory.followerBeforeRevisionB;

  it("follows KDX-2G4, since before revision B: the change notices page lists the part and the notice sent", async () => {
    const client = new TestClient();
    expect((await client.signIn(customer, demoPassword)).ok).toBe(true);
    const page = await getJson<SubscriptionsPage>(client, "/api/subscriptions");
    expect(page.follows.map((f) => f.label)).toEqual([expect.stringContaining("KDX-2G4")]);
    expect(page.sent.map((n) => n.subject)).toContain("KDX-2G4 revision B released");
    expect(page.sent.map((n) => n.subject)).not.toContain("KDX-2G4 revision A released");
  });

  it("was mailed the change notice of B, which says what changed since A, links both and can be stopped without signing in", async () => {
    let notices: CaughtMail[] = [];
    for (let waited = 0; waited < 20_000 && notices.length === 0; waited += 250) {
      notices = (await mailsTo(customer)).filter((m) => m.subject === "KDX-2G4 revision B released");
      if (notices.length === 0) await new Promise((r) => setTimeout(r, 250));
    }
    expect(notices).toHaveLength(1);
    const [notice] = notices;
    expect(notice.text).toContain("What changed since revision A:");
    expect(notice.text).toMatch(/Conversion loss.*max 11\.5\sdB → 11\sdB \(tightened\)/);
    expect(notice.text).toMatch(/Revision B: https?:\/\/\S+\/datasheets\/kestrine\/KDX-2G4\/B/);
    expect(notice.text).toMatch(/Revision A: https?:\/\/\S+\/datasheets\/kestrine\/KDX-2G4\/A/);
    expect(notice.text).toMatch(/\/unsubscribe\/\S+/);
    expect(notice.listUnsubscribe).toMatch(/^<https?:\/\/\S+\/api\/unsubscribe\?token=/);
  });
});
