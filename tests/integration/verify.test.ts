import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import type { VerifyAnswer } from "@/lib/domain/verify";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { releaseTwoRevisions } from "./helpers/reviews";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
let revA: RevisionSummary;
let revB: RevisionSummary;
let partNumber: string;
const anon = new TestClient();
const as = (who: Who) => clients.get(who)!;

async function verify(query: string): Promise<{ status: number; body: { verification?: VerifyAnswer; error?: { code: string; message: string } } }> {
  const r = await anon.request(`/api/v1/verify?${query}`);
  return { status: r.status, body: (await r.json()) as { verification?: VerifyAnswer; error?: { code: string; message: string } } };
}

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
  ({ partNumber, revA, revB } = await releaseTwoRevisions(org.organization.id, as("engineer"), as("reviewer")));
}, 180_000);
afterAll(() => closeDb());

describe("GET /api/v1/verify", () => {
  it("names the revision of a downloaded PDF by its SHA-256, signed out: current", async () => {
    const pdf = Buffer.from(await (await anon.request(revB.pdfPath)).arrayBuffer());
    // The outside reference: node's own SHA-256 of the bytes the public download sent.
    const sha = createHash("sha256").update(pdf).digest("hex");
    expect(sha).toBe(revB.pdfSha256);
    const { status, body } = await verify(`sha256=${sha.toUpperCase()}`);
    expect(status).toBe(200);
    const v = body.verification!;
    expect(v).toMatchObject({ organization: { name: org.organization.name, slug: org.organization.slug }, partNumber, letter: "B", standing: "current", reference: revB.reference, withdrawal: null, supersededBy: null, later: [] });
    expect(v.signers.map((s) => s.name)).toEqual([org.users.reviewer.name]);
    expect(v.releasedAt).toBe(revB.releasedAt);
  });

  it("an older printout by its footer reference (any case): superseded by B, with B's release notes", async () => {
    const { status, body } = await verify(`reference=${revA.reference.toLowerCase()}`);
    expect(status).toBe(200);
    const v = body.verification!;
    expect(v.letter).toBe("A");
    expect(v.standing).toBe("superseded");
    expect(v.supersededBy?.letter).toBe("B");
    expect(v.later.map((r) => r.letter)).toEqual(["B"]);
    expect(v.later[0].notes).toEqual(revB.notes);
    expect(v.later[0].notes).toContain("Second lot added.");
  });

  it("a withdrawn revision says so, with the reason; the one it superseded then has no current successor", async () => {
    const reason = "The drive level was read at the wrong reference plane.";
    const w = await as("reviewer").request(`/api/sheet-revisions/${revB.id}/withdraw`, { json: { reason } });
    expect(w.status, await w.clone().text()).toBe(200);
    const b = (await verify(`sha256=${revB.pdfSha256}`)).body.verification!;
    expect(b.standing).toBe("withdrawn");
    expect(b.withdrawal?.reason).toBe(reason);
    const a = (await verify(`reference=${revA.reference}`)).body.verification!;
    expect(a.standing).toBe("superseded");
    expect(a.supersededBy).toBeNull();
    expect(a.later.map((r) => [r.letter, r.standing])).toEqual([["B", "withdrawn"]]);
  });

  it("an unknown hash or reference is a 404 saying it is not a released Benchfold sheet", async () => {
    for (const q of [`sha256=${createHash("sha256").update("a draft printed from the workspace").digest("hex")}`, "reference=00000-00000"]) {
      const { status, body } = await verify(q);
      expect(status).toBe(404);
      expect(body.error?.message).toMatch(/not a released Benchfold sheet/);
    }
  });

  it.each([
    ["nothing", ""],
    ["both", `sha256=${"a".repeat(64)}&reference=7KQ2M-XR4TD`],
    ["two hashes", `sha256=${"a".repeat(64)}&sha256=${"b".repeat(64)}`],
    ["63 hex digits", `sha256=${"a".repeat(63)}`],
    ["65 hex digits", `sha256=${"a".repeat(65)}`],
    ["not hex", `sha256=${"g".repeat(64)}`],
    ["a reference with I, L, O or U", "reference=ILOU0-00000"],
    ["a reference without its dash", "reference=7KQ2MXR4TD"],
    ["ten thousand characters", `reference=${"A".repeat(10_000)}`],
    ["an SQL fragment", `sha256=${encodeURIComponent("' OR 1=1 -- ")}`],
  ])("%s → 422 with a message", async (_what, query) => {
    const { status, body } = await verify(query);
    expect(status).toBe(422);
    expect(body.error?.code).toBe("invalid");
    expect(body.error?.message.length).toBeGreaterThan(10);
  });

  it("the verify page opens signed out and as a customer", async () => {
    for (const client of [anon, as("customer")]) {
      const r = await client.request(`/verify?q=${revA.reference}`);
      expect(r.status).toBe(200);
      expect(await r.text()).toContain("Is this sheet released?");
    }
  });
});
