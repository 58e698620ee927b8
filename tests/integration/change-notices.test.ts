import bcrypt from "bcryptjs";
import { randomBytes } from "node:crypto";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import type { SubscriptionsPage, SubscriptionView } from "@/lib/domain/subscriptions";
import { closeDb, db } from "@/models";
import type { User } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, factoryPassword, makeOrganization, uniqueEmail, type Who } from "./helpers/factories";
import { mailsTo, type CaughtMail } from "./helpers/mailbox";
import { addApprovedSet, deviceWithApprovedData, releaseSheet } from "./helpers/reviews";

let vendor: Awaited<ReturnType<typeof makeOrganization>>;
let staff: Map<Who, TestClient>;
let deviceId: number;
let partNumber: string;
let revA: RevisionSummary;
let revB: RevisionSummary;
/** Four customers of a customer organization: follows the part, the class, both, nothing. */
const customers: Record<"part" | "cls" | "both" | "none", { user: User; client: TestClient }> = {} as never;
const as = (who: Who) => staff.get(who)!;

async function makeCustomer(organizationId: number, label: string) {
  const user = await db().User.create({ organizationId, email: uniqueEmail(label), name: `Customer ${label}`, role: "customer", passwordHash: bcrypt.hashSync(factoryPassword, 4) });
  const client = new TestClient();
  expect((await client.signIn(user.email, factoryPassword)).ok).toBe(true);
  return { user, client };
}

function follow(client: TestClient, body: unknown) {
  return client.request("/api/subscriptions", { json: body });
}

/** Waits until every follower notice of the event is marked sent by the run's outbox worker, then returns the caught mails. */
async function deliveredFollowerNotices(eventKey: string, expected: number): Promise<void> {
  for (let i = 0; i < 300; i++) {
    const [row] = await db().sequelize.query<{ n: number; sent: number }>(
      "SELECT COUNT(*) AS n, COALESCE(SUM(sent_at IS NOT NULL), 0) AS sent FROM outbox_messages WHERE event_key = ?",
      { type: QueryTypes.SELECT, replacements: [eventKey] },
    );
    if (Number(row.n) === expected && Number(row.sent) === expected) return;
    if (Number(row.n) > expected) throw new Error(`${row.n} notices queued for ${eventKey}, expected ${expected}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`the notices of ${eventKey} were not all sent in time`);
}

const about = (mails: CaughtMail[], words: string) => mails.filter((m) => m.subject.includes(`${partNumber} ${words}`));
const tokenIn = (text: string) => text.match(/\/unsubscribe\/([^\s]+)/)![1];

beforeAll(async () => {
  vendor = await makeOrganization();
  staff = await clientsByRole(vendor);
  const customerOrg = await db().Organization.create({ slug: `factory-buyer-${randomBytes(4).toString("hex")}`, name: "Factory Buyer", kind: "customer" });
  for (const key of ["part", "cls", "both", "none"] as const) customers[key] = await makeCustomer(customerOrg.id, key);
  deviceId = await deviceWithApprovedData(vendor.organization.id, as("engineer"), as("reviewer"));
}, 120_000);
afterAll(() => closeDb());

describe("following", () => {
  it("a part with no released sheet cannot be followed (404, as for a part that does not exist)", async () => {
    const device = await db().Device.findByPk(deviceId);
    partNumber = device!.partNumber;
    const r = await follow(customers.part.client, { organization: vendor.organization.slug, partNumber });
    expect(r.status).toBe(404);
    expect((await follow(customers.part.client, { organization: vendor.organization.slug, partNumber: "NO-SUCH-PART" })).status).toBe(404);
    expect((await follow(customers.part.client, { organization: "no-such-org", deviceClass: "frequency-multiplier" })).status).toBe(404);
  });

  it("after revision A, customers follow the part, the class, or both; again is no change; bad bodies are 422", async () => {
    revA = await releaseSheet(as("engineer"), as("reviewer"), deviceId, "First lot.");
    const part = { organization: vendor.organization.slug, partNumber };
    const cls = { organization: vendor.organization.slug, deviceClass: "frequency-multiplier" };
    expect((await follow(customers.part.client, part)).status).toBe(201);
    expect((await follow(customers.part.client, part)).status).toBe(200);
    expect((await follow(customers.cls.client, cls)).status).toBe(201);
    expect((await follow(customers.both.client, part)).status).toBe(201);
    expect((await follow(customers.both.client, cls)).status).toBe(201);
    for (const bad of [{}, { ...part, deviceClass: "frequency-multiplier" }, { organization: vendor.organization.slug, deviceClass: "flux-capacitor" }, { ...part, extra: 1 }, { organization: "x".repeat(10_000), partNumber }]) {
      expect((await follow(customers.none.client, bad)).status).toBe(422);
    }
    const list = (await (await customers.both.client.request("/api/subscriptions")).json()) as SubscriptionsPage;
    expect(list.follows.map((f) => f.kind).sort()).toEqual(["device-class", "part"]);
    expect(list.follows.find((f) => f.kind === "part")?.publicPath).toBe(`/datasheets/${vendor.organization.slug}/${encodeURIComponent(partNumber)}/current`);
  });

  it("staff cannot follow (the resource is the customers'), and one customer cannot stop another's subscription", async () => {
    expect((await follow(as("engineer"), { organization: vendor.organization.slug, partNumber })).status).toBe(403);
    const theirs = ((await (await customers.part.client.request("/api/subscriptions")).json()) as SubscriptionsPage).follows[0] as SubscriptionView;
    expect((await customers.none.client.request(`/api/subscriptions/${theirs.id}`, { method: "DELETE" })).status).toBe(404);
  });
});

describe("a new revision", () => {
  it("sends exactly one mail per follower through the outbox: what changed, both revisions, an unsubscribe link and List-Unsubscribe", async () => {
    await addApprovedSet(deviceId, as("engineer"), as("reviewer"), "docs/drive-sweep-doubler-unit-6.csv");
    revB = await releaseSheet(as("engineer"), as("reviewer"), deviceId, "Second lot added.");
    await deliveredFollowerNotices(`sheet-revision:${revB.id}:released:follower`, 3);
    for (const key of ["part", "cls", "both"] as const) {
      const mails = about(await mailsTo(customers[key].user.email), "revision B released");
      expect(mails, key).toHaveLength(1);
      const [mail] = mails;
      expect(mail.text).toContain(`What changed since revision A:`);
      for (const note of revB.notes.slice(0, 8)) expect(mail.text).toContain(`  - ${note}`);
      expect(mail.text).toContain(`/datasheets/${vendor.organization.slug}/${encodeURIComponent(partNumber)}/B`);
      expect(mail.text).toContain(`/datasheets/${vendor.organization.slug}/${encodeURIComponent(partNumber)}/A`);
      const token = tokenIn(mail.text);
      expect(mail.listUnsubscribe).toBe(`<${process.env.BENCHFOLD_TEST_URL ?? "http://localhost:3100"}/api/unsubscribe?token=${encodeURIComponent(token)}>`);
      expect(mail.text).toContain(key === "cls" ? "every frequency multiplier of" : `you follow ${partNumber} of`);
    }
    expect(about(await mailsTo(customers.none.user.email), "revision B released")).toHaveLength(0);
  });

  it("the subscriptions page lists what was sent", async () => {
    const list = (await (await customers.part.client.request("/api/subscriptions")).json()) as SubscriptionsPage;
    expect(list.sent.map((m) => m.subject)).toContain(`${partNumber} revision B released`);
    expect(list.sent.find((m) => m.subject.includes("revision B"))?.sentAt).not.toBeNull();
    const page = await customers.part.client.request("/subscriptions");
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(`${partNumber} revision B released`);
  });
});

describe("unsubscribing without signing in", () => {
  it("an altered token is refused (422, on the page too) and stops nothing; the right one stops the part, twice harmlessly", async () => {
    const [mail] = about(await mailsTo(customers.part.user.email), "revision B released");
    const token = tokenIn(mail.text);
    const anon = new TestClient();
    const last = token.at(-1)!;
    const altered = [token.slice(0, -1) + (last === "A" ? "B" : "A"), token.replace(/^\d/, (d) => String((Number(d) % 9) + 1)), token.slice(0, 10) + (token[10] === "x" ? "y" : "x") + token.slice(11)];
    for (const bad of altered) {
      const r = await anon.request("/api/unsubscribe", { json: { token: bad } });
      expect(r.status, bad).toBe(422);
      expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/not valid/);
    }
    const badPage = await anon.request(`/unsubscribe/${altered[0]}`);
    expect(badPage.status).toBe(200);
    expect(await badPage.text()).toContain("This unsubscribe link is not valid");
    expect(await db().Subscription.count({ where: { userId: customers.part.user.id } })).toBe(1);

    const page = await anon.request(`/unsubscribe/${token}`);
    expect(await page.text()).toContain(`${partNumber} of ${vendor.organization.name}`);
    const ok = await anon.request("/api/unsubscribe", { json: { token } });
    expect(ok.status).toBe(200);
    expect(await ok.json()).toMatchObject({ unsubscribed: true, alreadyStopped: false });
    expect(await db().Subscription.count({ where: { userId: customers.part.user.id } })).toBe(0);
    const again = await anon.request("/api/unsubscribe", { json: { token } });
    expect(await again.json()).toMatchObject({ unsubscribed: true, alreadyStopped: true });
  });

  it("a mail client's one-click POST to the List-Unsubscribe address works (RFC 8058), with no Origin and no session", async () => {
    const [mail] = about(await mailsTo(customers.cls.user.email), "revision B released");
    const url = new URL(mail.listUnsubscribe!.slice(1, -1));
    const r = await new TestClient().request(`${url.pathname}${url.search}`, { form: { "List-Unsubscribe": "One-Click" }, origin: null });
    expect(r.status, await r.clone().text()).toBe(200);
    expect(await db().Subscription.count({ where: { userId: customers.cls.user.id } })).toBe(0);
  });
});

describe("a withdrawal", () => {
  it("tells the remaining followers once, with the reason and the revision current now; the unsubscribed hear nothing", async () => {
    const reason = "The conversion loss of lot 2 was read with an uncalibrated cable.";
    const w = await as("reviewer").request(`/api/sheet-revisions/${revB.id}/withdraw`, { json: { reason } });
    expect(w.status, await w.clone().text()).toBe(200);
    await deliveredFollowerNotices(`sheet-revision:${revB.id}:withdrawn:follower`, 1);
    const [mail, ...more] = about(await mailsTo(customers.both.user.email), "revision B withdrawn");
    expect(more).toHaveLength(0);
    expect(mail.text).toContain(reason);
    expect(mail.text).toContain("No revision of this part is current now.");
    expect(mail.listUnsubscribe).toMatch(/\/api\/unsubscribe\?token=/);
    for (const key of ["part", "cls", "none"] as const) expect(about(await mailsTo(customers[key].user.email), "revision B withdrawn"), key).toHaveLength(0);
  });
});
