import { afterAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization, uniqueEmail } from "./helpers/factories";
import { firstLink, waitForMail } from "./helpers/mailbox";

// No answer tells whether an address has an account: the status and the body are the same for a
// known and an unknown address on sign-up, password reset, sign-in and invitation. The timing of
// the two cases is compared in `npm run bench` (scripts/bench.ts), never here.

afterAll(() => closeDb());

const strongPassword = "a long sentence for a password";

async function answer(r: Response): Promise<{ status: number; body: string }> {
  return { status: r.status, body: await r.text() };
}

describe("sign-up", () => {
  const { User } = db();
  const signUp = (email: string) =>
    new TestClient().request("/api/accounts", { json: { name: "Probe Person", email, password: strongPassword, company: "Probe Instruments" } });

  it("answers an address with an account exactly as a new one, and mails its owner instead of creating anything", async () => {
    const { users } = await makeOrganization();
    const fresh = uniqueEmail("newcomer");
    const known = await answer(await signUp(users.customer.email));
    const unknown = await answer(await signUp(fresh));
    expect(known.status).toBe(202);
    expect(known).toEqual(unknown);

    const notice = await waitForMail(users.customer.email);
    expect(notice.text).toMatch(/tried to create a Benchfold account with this address/);
    expect(firstLink(notice.text).pathname).toBe("/sign-in");
    expect(notice.text).toMatch(/reset it: http\S+\/password-reset\n/);
    const owner = await User.findByPk(users.customer.id);
    expect(owner?.passwordHash).toBe(users.customer.passwordHash);
    expect(owner?.name).toBe(users.customer.name);
  });

  it("creates the account only when the mailed link is followed, once", async () => {
    const email = uniqueEmail("buyer");
    expect((await signUp(email)).status).toBe(202);
    expect(await User.count({ where: { email } })).toBe(0);

    const mail = await waitForMail(email);
    const link = firstLink(mail.text);
    expect(link.pathname).toMatch(/^\/sign-up\/confirm\/[A-Za-z0-9_-]{20,}$/);
    const token = link.pathname.split("/").pop()!;
    const visitor = new TestClient();
    expect((await visitor.request(link.pathname)).status).toBe(200);
    const confirmed = await visitor.request("/api/accounts/confirm", { json: { token } });
    expect(confirmed.status).toBe(201);
    expect(await User.findOne({ where: { email } })).toMatchObject({ role: "customer", name: "Probe Person" });
    expect((await visitor.signIn(email, strongPassword)).ok).toBe(true);
    const me = (await (await visitor.request("/api/me")).json()) as { user: { organizationName: string; organizationKind: string } };
    expect(me.user).toMatchObject({ organizationName: "Probe Instruments", organizationKind: "customer" });

    expect((await new TestClient().request("/api/accounts/confirm", { json: { token } })).status).toBe(404);
  });

  it("a confirmation link for an address that got an account meanwhile creates nothing", async () => {
    const email = uniqueEmail("twice");
    await signUp(email);
    await signUp(email);
    const { messages } = (await (await fetch(`http://127.0.0.1:${process.env.BENCHFOLD_MAILBOX_PORT ?? 2581}/messages`)).json()) as { messages: { to: string; text: string }[] };
    const tokens = messages.filter((m) => m.to === email).map((m) => firstLink(m.text).pathname.split("/").pop()!);
    expect(tokens).toHaveLength(2);
    expect((await new TestClient().request("/api/accounts/confirm", { json: { token: tokens[0] } })).status).toBe(201);
    // Only the holder of the link, who reads the address's mail, learns that it is taken.
    const second = await new TestClient().request("/api/accounts/confirm", { json: { token: tokens[1] } });
    expect(second.status).toBe(409);
    expect(await User.count({ where: { email } })).toBe(1);
  });
});

describe("password reset", () => {
  it("answers the same for a known, an unknown and a disabled address; each gets a mail", async () => {
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    await admin.request(`/api/admin/users/${users.reviewer.id}`, { method: "PATCH", json: { disabled: true } });
    const nobody = uniqueEmail("nobody");
    const ask = (email: string) => new TestClient().request("/api/password-resets", { json: { email } });
    const known = await answer(await ask(users.customer.email));
    const unknown = await answer(await ask(nobody));
    const disabled = await answer(await ask(users.reviewer.email));
    expect(known.status).toBe(202);
    expect(unknown).toEqual(known);
    expect(disabled).toEqual(known);

    expect(firstLink((await waitForMail(users.customer.email)).text).pathname).toMatch(/^\/password-reset\/[A-Za-z0-9_-]{20,}$/);
    expect((await waitForMail(nobody)).text).toMatch(/no active Benchfold account/);
    expect((await waitForMail(users.reviewer.email)).text).toMatch(/no active Benchfold account/);
  });
});

describe("sign-in", () => {
  it("fails with the same answer for a wrong password, an unknown address and a disabled account", async () => {
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    await admin.request(`/api/admin/users/${users.engineer.id}`, { method: "PATCH", json: { disabled: true } });
    const wrong = await new TestClient().signIn(users.customer.email, "not-the-password-1");
    const unknown = await new TestClient().signIn(uniqueEmail("stranger"), "not-the-password-1");
    const disabled = await new TestClient().signIn(users.engineer.email, factoryPassword);
    expect(wrong).toEqual({ ok: false, error: "invalid-credentials" });
    expect(unknown).toEqual(wrong);
    expect(disabled).toEqual(wrong);
  });
});

describe("invitations", () => {
  const { Invitation, User } = db();
  it("inviting an address that has an account elsewhere answers as for a new address and tells only its owner", async () => {
    const elsewhere = await makeOrganization();
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    const fresh = uniqueEmail("invitee");
    const a = await admin.request("/api/admin/invitations", { json: { email: fresh, role: "engineer" } });
    const b = await admin.request("/api/admin/invitations", { json: { email: elsewhere.users.engineer.email, role: "engineer" } });
    expect(a.status).toBe(201);
    expect(b.status).toBe(a.status);
    const shape = (v: { invitation: Record<string, unknown> }) => Object.keys(v.invitation).sort();
    const bodyA = (await a.json()) as { invitation: Record<string, unknown> };
    const bodyB = (await b.json()) as { invitation: Record<string, unknown> };
    expect(shape(bodyB)).toEqual(shape(bodyA));
    expect(bodyB.invitation).toMatchObject({ email: elsewhere.users.engineer.email, role: "engineer" });

    const list = (await (await admin.request("/api/admin/invitations")).json()) as { invitations: { email: string }[] };
    expect(list.invitations.map((i) => i.email).sort()).toEqual([fresh, elsewhere.users.engineer.email].sort());

    const mail = await waitForMail(elsewhere.users.engineer.email);
    expect(mail.text).toMatch(/already have a Benchfold account/);
    expect(mail.text).not.toMatch(/\/invitations\//);
    const stillThere = await User.findByPk(elsewhere.users.engineer.id);
    expect(stillThere?.organizationId).toBe(elsewhere.organization.id);
    expect(await Invitation.count({ where: { email: elsewhere.users.engineer.email } })).toBe(1);
  });

  it("inviting someone already in the organization is refused: the admin sees them in the people list anyway", async () => {
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    const r = await admin.request("/api/admin/invitations", { json: { email: users.engineer.email, role: "engineer" } });
    expect(r.status).toBe(409);
  });
});

// NIST SP 800-63B §5.1.1.2 (memorized secret verifiers): at least 8 characters, at least 64
// allowed and never truncated, checked against commonly used and compromised values and
// context-specific words, no composition rules. The server applies the check on every path that sets a password.
describe("password strength on every path that sets a password", () => {
  const weak = [
    ["too short (7)", "k9#vQ2m"],
    ["a common password", "password123"],
    ["a keyboard walk", "qwertyuiop"],
    ["a repeated character", "aaaaaaaaaaaa"],
    ["the service's name", "benchfold2026"],
    ["more than bcrypt reads (73 bytes), which would be cut short", "a quiet lab at dawn, the analyzer warming and the coffee cold; then noise"],
  ] as const;

  it.each(weak)("sign-up refuses %s", async (_, password) => {
    const r = await new TestClient().request("/api/accounts", { json: { name: "Weak Pw", email: uniqueEmail("weak"), password, company: "Weak Co" } });
    expect(r.status).toBe(422);
    expect(((await r.json()) as { error: { details: { fields: { field: string }[] } } }).error.details.fields[0].field).toBe("password");
  });

  it.each(weak)("password reset completion refuses %s", async (_, password) => {
    const r = await new TestClient().request("/api/password-resets/complete", { json: { token: "x".repeat(43), password } });
    expect(r.status).toBe(422);
  });

  it.each(weak)("accepting an invitation refuses %s", async (_, password) => {
    const r = await new TestClient().request("/api/invitations/accept", { json: { token: "x".repeat(43), name: "Someone", password } });
    expect(r.status).toBe(422);
  });

  it("accepts a 64-character passphrase and a random 9-character password", async () => {
    for (const password of ["the kettle sang twice before the bench supply finally settled ok", "vK8#qz!Tp"]) {
      const r = await new TestClient().request("/api/accounts", { json: { name: "Strong Pw", email: uniqueEmail("strong"), password, company: "Strong Co" } });
      expect(r.status, password).toBe(202);
    }
  });
});

describe("sign-up and reset mails are limited, per recipient and per client address", () => {
  // Limits of the test server: the defaults, 5 mails per recipient and 20 per client address an hour.
  it("the sixth reset mail to one address in an hour is refused (429) alike for an account and for an address without one", async () => {
    const made = await makeOrganization();
    const ask = (email: string) => new TestClient().request("/api/password-resets", { json: { email } });
    for (const email of [made.users.customer.email, uniqueEmail("nobody")]) {
      for (let i = 0; i < 5; i++) expect((await ask(email)).status, `${email} #${i + 1}`).toBe(202);
      const refused = await ask(email);
      expect(refused.status).toBe(429);
      expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/try again in an hour/);
    }
  });

  it("one client address asks for at most 20 sign-up or reset mails an hour, to any addresses", async () => {
    const client = new TestClient();
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) {
      const r = i % 2
        ? await client.request("/api/password-resets", { json: { email: uniqueEmail("spray") } })
        : await client.request("/api/accounts", { json: { name: "Spray", email: uniqueEmail("spray"), password: strongPassword, company: "Spray Co" } });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 20).every((s) => s === 202)).toBe(true);
    expect(statuses[20]).toBe(429);
  });
});
