import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import type { CandidateDetail, RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { closeDb, db } from "@/models";
import { TestClient } from "./helpers/client";
import { mailsTo, setFakeSmtpListening } from "./helpers/mailbox";
import { clientsByRole, factoryPassword, makeOrganization, type Who } from "./helpers/factories";
import {
  acknowledgeAll,
  addApprovedSet,
  deviceWithApprovedData,
  release,
  releaseSheet,
  requestChanges,
  sign,
  submit,
  submitDraft,
} from "./helpers/reviews";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
const as = (who: Who) => clients.get(who)!;

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
});
afterAll(() => closeDb());

async function draft(deviceId: number): Promise<SheetModel> {
  const r = await as("engineer").request(`/api/devices/${deviceId}/sheet`);
  return ((await r.json()) as { sheet: SheetModel }).sheet;
}

/** Sets a max limit on the draft's first statistics group (the value given). */
async function setFirstMax(deviceId: number, max: number): Promise<void> {
  const group = (await draft(deviceId)).statistics.groups[0];
  const r = await as("engineer").request(`/api/devices/${deviceId}/spec-limits`, {
    method: "PUT",
    json: { limits: [{ parameter: group.parameter, conditionsKey: group.conditionsKey, max, unit: group.unit, basis: "characterization" }] },
  });
  expect(r.status, await r.clone().text()).toBe(200);
}

describe("submitting a draft", () => {
  it("needs every open issue acknowledged with a reason (422 naming the issues), then freezes the model with its digest", async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const refused = await submit(as("engineer"), deviceId, { acknowledgements: [] });
    expect(refused.status).toBe(422);
    const { error } = (await refused.json()) as { error: { message: string; details: { issues: { message: string }[] } } };
    expect(error.message).toMatch(/open issue/);
    expect(error.details.issues.length).toBeGreaterThan(0);

    const shortReason = await submit(as("engineer"), deviceId, { acknowledgements: (await acknowledgeAll(as("engineer"), deviceId)).map((a) => ({ ...a, reason: "ok" })) });
    expect(shortReason.status).toBe(422);

    const candidate = await submitDraft(as("engineer"), deviceId, "First look, please.");
    expect(candidate.state).toBe("in-review");
    expect(candidate.acknowledgements.length).toBeGreaterThan(0);
    expect(candidate.previousModel).toBeNull();
    const { SheetCandidate } = db();
    const row = await SheetCandidate.findByPk(candidate.id);
    // The digest is the SHA-256 of the stored model's bytes.
    expect(createHash("sha256").update(row!.modelJson).digest("hex")).toBe(row!.modelDigest);
    expect(candidate.model.header.state).toBe("in-review");

    const again = await submit(as("engineer"), deviceId, { acknowledgements: await acknowledgeAll(as("engineer"), deviceId) });
    expect(again.status).toBe(409);
  });

  it("goes stale when the limits change after submission: the reviewer cannot sign it, and both people are told why", async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const candidate = await submitDraft(as("engineer"), deviceId);
    await as("reviewer").request(`/api/sheet-candidates/${candidate.id}/comments`, { json: { anchor: { kind: "sheet" }, body: "Looking at it." } });
    await setFirstMax(deviceId, 40);
    const signed = await sign(as("reviewer"), candidate.id);
    expect(signed.status).toBe(409);
    const detail = ((await (await as("engineer").request(`/api/sheet-candidates/${candidate.id}`)).json()) as { candidate: CandidateDetail }).candidate;
    expect(detail.state).toBe("stale");
    expect(detail.staleReason).toMatch(/changed after it was submitted/);
    const [{ n }] = await db().sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM outbox_messages WHERE event_key = ? AND recipient IN (?, ?)",
      { type: QueryTypes.SELECT, replacements: [`sheet-candidate:${candidate.id}:stale`, org.users.engineer.email, org.users.reviewer.email] },
    );
    expect(n).toBe(2);
  });
});

describe("the electronic signature", () => {
  // 21 CFR Part 11 §11.200(a)(1): two distinct identification components — the signed-in account
  // (identification code) and its password, asked again at the moment of signing.
  it("refuses a wrong password, records nothing, and counts the failure toward the sign-in limit", async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const candidate = await submitDraft(as("engineer"), deviceId);
    const { SignInAttempt, SheetSignature } = db();
    const before = await SignInAttempt.count({ where: { email: org.users.reviewer.email, succeeded: false } });
    const wrong = await sign(as("reviewer"), candidate.id, "not-the-password");
    expect(wrong.status).toBe(422);
    expect(((await wrong.json()) as { error: { message: string } }).error.message).toMatch(/password is not correct/);
    expect(await SignInAttempt.count({ where: { email: org.users.reviewer.email, succeeded: false } })).toBe(before + 1);
    expect(await SheetSignature.count({ where: { candidateId: candidate.id } })).toBe(0);
  });

  // §11.50(a): the signed record shows the printed name, the date and time, and the meaning;
  // §11.70: the signature is linked to its record (the candidate digest) so it cannot be moved.
  it("records printed name, role, organization, UTC time, meaning and the candidate's digest", async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const candidate = await submitDraft(as("engineer"), deviceId);
    const started = Date.now();
    const r = await sign(as("reviewer"), candidate.id);
    expect(r.status, await r.clone().text()).toBe(200);
    const { candidate: signed } = (await r.json()) as { candidate: CandidateDetail };
    expect(signed.state).toBe("approved");
    const [signature] = signed.signatures;
    expect(signature.printedName).toBe(org.users.reviewer.name);
    expect(signature.roleWord).toBe("Reviewer");
    expect(signature.organizationName).toBe(org.organization.name);
    expect(signature.meaning).toBe("approved-for-release");
    expect(signature.candidateDigest).toBe(candidate.digest);
    expect(Math.abs(Date.parse(signature.signedAt) - started)).toBeLessThan(60_000);
    expect(signature.signedAt.endsWith("Z")).toBe(true);
  });

  it("cannot be attached to another candidate: the database refuses a signature whose digest is not its candidate's (§11.70)", async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const candidate = await submitDraft(as("engineer"), deviceId);
    await expect(
      db().sequelize.query(
        "INSERT INTO sheet_signatures (organization_id, candidate_id, signer_id, printed_name, role_word, organization_name, meaning, candidate_digest, signed_at, created_at) VALUES (?, ?, ?, 'X', 'Reviewer', 'Y', 'approved-for-release', ?, NOW(3), NOW(3))",
        { replacements: [org.organization.id, candidate.id, org.users.reviewer.id, "0".repeat(64)] },
      ),
    ).rejects.toThrow(/not the candidate/);
  });

  it("four eyes hold after a role change: the submitter, made a reviewer, still cannot approve their own submission", async () => {
    const made = await makeOrganization();
    const people = await clientsByRole(made);
    const deviceId = await deviceWithApprovedData(made.organization.id, people.get("engineer")!, people.get("reviewer")!);
    const candidate = await submitDraft(people.get("engineer")!, deviceId);
    const promote = await people.get("admin")!.request(`/api/admin/users/${made.users.engineer.id}`, { method: "PATCH", json: { role: "reviewer" } });
    expect(promote.status, await promote.clone().text()).toBe(200);
    const queue = await people.get("engineer")!.request("/api/sheet-candidates/pending");
    expect(queue.status).toBe(200);
    expect(((await queue.json()) as { candidates: { id: number }[] }).candidates.map((c) => c.id)).not.toContain(candidate.id);
    const own = await sign(people.get("engineer")!, candidate.id);
    expect(own.status).toBe(403);
    expect(((await own.json()) as { error: { message: string } }).error.message).toMatch(/another reviewer/);
  });

  it("an organization that requires two signatures approves only after two different reviewers sign", async () => {
    const made = await makeOrganization();
    await made.organization.update({ requiredSignatures: 2 });
    const people = await clientsByRole(made);
    const { User } = db();
    const second = await User.create({ organizationId: made.organization.id, email: `quality-${made.organization.slug}@factory.example`, name: "Quality Reviewer", role: "reviewer", passwordHash: made.users.reviewer.passwordHash });
    const quality = new TestClient();
    expect((await quality.signIn(second.email, factoryPassword)).ok).toBe(true);
    const deviceId = await deviceWithApprovedData(made.organization.id, people.get("engineer")!, people.get("reviewer")!);
    const candidate = await submitDraft(people.get("engineer")!, deviceId);
    const first = ((await (await sign(people.get("reviewer")!, candidate.id)).json()) as { candidate: CandidateDetail }).candidate;
    expect(first.state).toBe("in-review");
    expect((await sign(people.get("reviewer")!, candidate.id)).status).toBe(409);
    expect((await release(people.get("engineer")!, candidate.id)).status).toBe(409);
    const both = ((await (await sign(quality, candidate.id)).json()) as { candidate: CandidateDetail }).candidate;
    expect(both.state).toBe("approved");
    expect(both.signatures.map((s) => s.printedName)).toEqual([made.users.reviewer.name, "Quality Reviewer"]);
  });
});

describe("release", () => {
  let deviceId: number;
  let revisionA: RevisionSummary;

  beforeAll(async () => {
    deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    revisionA = await releaseSheet(as("engineer"), as("reviewer"), deviceId, "Initial characterization.");
  });

  it("gives letter A, stores the PDF with its SHA-256, and every download returns those bytes", async () => {
    expect(revisionA.letter).toBe("A");
    expect(revisionA.standing).toBe("current");
    expect(revisionA.notes).toEqual(["First release.", "Initial characterization."]);
    const anon = new TestClient();
    const first = await anon.request(revisionA.pdfPath);
    expect(first.status).toBe(200);
    const bytes = Buffer.from(await first.arrayBuffer());
    const second = Buffer.from(await (await anon.request(revisionA.pdfPath)).arrayBuffer());
    expect(second.equals(bytes)).toBe(true);
    const sha = createHash("sha256").update(bytes).digest("hex");
    expect(sha).toBe(revisionA.pdfSha256);
    const [row] = await db().sequelize.query<{ pdf_sha256: string }>("SELECT pdf_sha256 FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [revisionA.id] });
    expect(row.pdf_sha256).toBe(sha);
    expect(first.headers.get("etag")).toBe(`"${sha}"`);
    expect(first.headers.get("content-disposition")).toMatch(/-rev-A\.pdf"/);
    expect(first.headers.get("cache-control")).toMatch(/immutable/);
    const notModified = await anon.request(revisionA.pdfPath, { headers: { "if-none-match": `"${sha}"` } });
    expect(notModified.status).toBe(304);
  });

  it("is unchanged after new data arrives: the released PDF and model stay as released", async () => {
    const before = Buffer.from(await (await new TestClient().request(revisionA.pdfPath)).arrayBuffer());
    const [modelBefore] = await db().sequelize.query<{ model_json: string }>("SELECT model_json FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [revisionA.id] });
    await addApprovedSet(deviceId, as("engineer"), as("reviewer"), "docs/drive-sweep-doubler-unit-6.csv");
    expect((await draft(deviceId)).traceability.measurementSets.length).toBe(2);
    const after = Buffer.from(await (await new TestClient().request(revisionA.pdfPath)).arrayBuffer());
    expect(after.equals(before)).toBe(true);
    const [modelAfter] = await db().sequelize.query<{ model_json: string }>("SELECT model_json FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [revisionA.id] });
    expect(modelAfter.model_json).toBe(modelBefore.model_json);
    expect((JSON.parse(modelAfter.model_json) as SheetModel).traceability.measurementSets.length).toBe(1);
  });

  it("of ten concurrent requests exactly one succeeds; the others get 409, and B supersedes A", async () => {
    const candidate = await submitDraft(as("engineer"), deviceId);
    expect(candidate.comparedRevision).toBe("A");
    expect(candidate.previousModel?.header.revisionLabel).toBe("A");
    expect((await sign(as("reviewer"), candidate.id)).status).toBe(200);
    const answers = await Promise.all(Array.from({ length: 10 }, () => release(as("engineer"), candidate.id, "Second lot.")));
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses).toEqual([201, ...Array(9).fill(409)]);
    const revisions = ((await (await as("engineer").request(`/api/devices/${deviceId}/revisions`)).json()) as { revisions: RevisionSummary[] }).revisions;
    expect(revisions.map((r) => [r.letter, r.standing])).toEqual([["B", "current"], ["A", "superseded"]]);
    const { SheetRevision } = db();
    expect(await SheetRevision.count({ where: { deviceId } })).toBe(2);
  });

  it("the released model carries the letter, the release date and the signatures; the draft stays a draft", async () => {
    const anon = new TestClient();
    const page = await anon.request(`/api/v1/sheets/${org.organization.slug}/${encodeURIComponent(revisionA.publicPath.split("/")[3])}/A/pdf`);
    expect(page.status).toBe(200);
    const [row] = await db().sequelize.query<{ model_json: string }>("SELECT model_json FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [revisionA.id] });
    const model = JSON.parse(row.model_json) as SheetModel;
    expect(model.header.revisionText).toBe("Rev. A");
    expect(model.header.banner).toBeNull();
    expect(model.release?.signatures[0].name).toBe(org.users.reviewer.name);
    expect(model.release?.verificationReference).toBe(revisionA.reference);
    expect((await draft(deviceId)).header.revisionLabel).toBeNull();
  });

  it("records are immutable: raw SQL UPDATE and DELETE are refused on revisions, signatures and withdrawals", async () => {
    const q = (sql: string) => db().sequelize.query(sql, { replacements: [revisionA.id] });
    await expect(q("UPDATE sheet_revisions SET letter = 'Z' WHERE id = ?")).rejects.toThrow(/append-only/);
    await expect(q("UPDATE sheet_revisions SET pdf_sha256 = REPEAT('0', 64) WHERE id = ?")).rejects.toThrow(/append-only/);
    await expect(q("DELETE FROM sheet_revisions WHERE id = ?")).rejects.toThrow(/append-only/);
    const cand = "(SELECT candidate_id FROM sheet_revisions WHERE id = ?)";
    await expect(q(`UPDATE sheet_signatures SET printed_name = 'Someone else' WHERE candidate_id = ${cand}`)).rejects.toThrow(/append-only/);
    await expect(q(`DELETE FROM sheet_signatures WHERE candidate_id = ${cand}`)).rejects.toThrow(/append-only/);
    await expect(q(`UPDATE sheet_candidates SET model_json = '{}' WHERE id = ${cand}`)).rejects.toThrow(/frozen/);
    await expect(q(`DELETE FROM sheet_candidates WHERE id = ${cand}`)).rejects.toThrow(/kept/);
    const w = await as("reviewer").request(`/api/sheet-revisions/${revisionA.id}/withdraw`, { json: { reason: "Superseded data error in lot 1 — do not use." } });
    expect(w.status, await w.clone().text()).toBe(200);
    await expect(q("UPDATE sheet_revision_withdrawals SET reason = 'never mind' WHERE revision_id = ?")).rejects.toThrow(/append-only/);
    await expect(q("DELETE FROM sheet_revision_withdrawals WHERE revision_id = ?")).rejects.toThrow(/append-only/);
  });

  it("a withdrawn revision stays downloadable, says so, and cannot be withdrawn twice", async () => {
    const r = await new TestClient().request(revisionA.pdfPath);
    expect(r.status).toBe(200);
    expect(r.headers.get("x-benchfold-standing")).toBe("withdrawn");
    const again = await as("admin").request(`/api/sheet-revisions/${revisionA.id}/withdraw`, { json: { reason: "Trying to withdraw it twice." } });
    expect(again.status).toBe(409);
  });
});

/**
 * Every transition of the review, by candidate state and role: allowed (the status of success) or
 * refused (the status of refusal). Roles outside the organization's sheet work get 403 before the
 * state is looked at; a role that may act but not in this state gets 409.
 */
describe("state × action × role", () => {
  type Action = "comment" | "request-changes" | "approve" | "release";
  const act: Record<Action, (c: TestClient, id: number) => Promise<Response>> = {
    comment: (c, id) => c.request(`/api/sheet-candidates/${id}/comments`, { json: { anchor: { kind: "sheet" }, body: "A note." } }),
    "request-changes": (c, id) => requestChanges(c, id),
    approve: (c, id) => sign(c, id),
    release: (c, id) => release(c, id),
  };
  const allowed: Record<Action, Partial<Record<Who, number>>> = {
    comment: { engineer: 201, reviewer: 201 },
    "request-changes": { reviewer: 200 },
    approve: { reviewer: 200 },
    release: { engineer: 201 },
  };
  /** Which actions each state admits (for a role allowed the action). */
  const admits: Record<string, Action[]> = {
    "in-review": ["comment", "request-changes", "approve"],
    "changes-requested": ["comment"],
    approved: ["release"],
    released: [],
    stale: [],
  };
  const refusedStatus = (who: Who) => (who === "signed-out" ? 401 : 403);

  async function candidateIn(state: string): Promise<number> {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const c = await submitDraft(as("engineer"), deviceId);
    if (state === "changes-requested") expect((await requestChanges(as("reviewer"), c.id)).status).toBe(200);
    if (state === "approved" || state === "released") expect((await sign(as("reviewer"), c.id)).status).toBe(200);
    if (state === "released") expect((await release(as("engineer"), c.id)).status).toBe(201);
    if (state === "stale") await setFirstMax(deviceId, 50);
    return c.id;
  }

  for (const state of Object.keys(admits)) {
    for (const action of Object.keys(act) as Action[]) {
      it(`${state}: ${action}`, async () => {
        // One candidate per case: the refused roles first (they change nothing), the admitted role last.
        const id = await candidateIn(state);
        const order: Who[] = ["signed-out", "customer", "admin", "engineer", "reviewer"].sort(
          (a, b) => Number(allowed[action][a as Who] !== undefined) - Number(allowed[action][b as Who] !== undefined),
        ) as Who[];
        for (const who of order) {
          const r = await act[action](as(who), id);
          const success = allowed[action][who];
          const expected = success === undefined ? refusedStatus(who) : admits[state].includes(action) ? success : 409;
          expect(r.status, `${who} ${action} on ${state}: ${await r.clone().text()}`).toBe(expected);
        }
      }, 60_000);
    }
  }
});

describe("notices through the outbox", () => {
  it("a release during an SMTP outage loses no notice and sends none twice: exactly one mail per recipient once SMTP is back", async () => {
    const made = await makeOrganization();
    const people = await clientsByRole(made);
    const eng = people.get("engineer")!;
    const rev = people.get("reviewer")!;
    const deviceId = await deviceWithApprovedData(made.organization.id, eng, rev);
    const candidate = await submitDraft(eng, deviceId);
    expect((await sign(rev, candidate.id)).status).toBe(200);
    const recipients = [made.users.engineer.email, made.users.reviewer.email];
    const released = (m: { subject: string }) => /released as revision A/.test(m.subject);
    await setFakeSmtpListening(false);
    try {
      expect((await release(eng, candidate.id)).status).toBe(201);
      // The worker tries and fails while the port is closed; nothing is marked sent.
      await new Promise((resolve) => setTimeout(resolve, 2_000));
      const [{ sent }] = await db().sequelize.query<{ sent: number }>(
        "SELECT COUNT(sent_at) AS sent FROM outbox_messages WHERE event_key = ?",
        { type: QueryTypes.SELECT, replacements: [`sheet-candidate:${candidate.id}:released`] },
      );
      expect(Number(sent)).toBe(0);
      for (const to of recipients) expect((await mailsTo(to)).filter(released)).toEqual([]);
    } finally {
      await setFakeSmtpListening(true);
    }
    const until = Date.now() + 90_000;
    while (Date.now() < until && !(await Promise.all(recipients.map(async (to) => (await mailsTo(to)).some(released)))).every(Boolean)) {
      await new Promise((resolve) => setTimeout(resolve, 500));
    }
    // A little longer, so a second copy would have time to arrive.
    await new Promise((resolve) => setTimeout(resolve, 2_000));
    for (const to of recipients) expect((await mailsTo(to)).filter(released).length, to).toBe(1);
  }, 120_000);
});
