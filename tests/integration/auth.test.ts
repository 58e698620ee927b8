import bcrypt from "bcryptjs";
import { afterAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization, uniqueEmail } from "./helpers/factories";
import { firstLink, waitForMail } from "./helpers/mailbox";
import { nonLoopbackBaseUrl } from "./helpers/network";

afterAll(() => closeDb());

describe("sign-in", () => {
  it("signs in with the right password and refuses a wrong one", async () => {
    const { users } = await makeOrganization();
    expect((await new TestClient().signIn(users.engineer.email, "wrong-password-x")).error).toBe("invalid-credentials");
    expect((await new TestClient().signIn(users.engineer.email, factoryPassword)).ok).toBe(true);
  });

  it("locks an account after 5 failures, even for the right password, from any address", async () => {
    const { users } = await makeOrganization();
    for (let i = 0; i < 5; i += 1) {
      expect((await new TestClient().signIn(users.reviewer.email, `wrong-${i}-password`)).error).toBe("invalid-credentials");
    }
    const fresh = new TestClient();
    const result = await fresh.signIn(users.reviewer.email, factoryPassword);
    expect(result).toEqual({ ok: false, error: "too-many-attempts" });
  });

  it("limits failures per address across accounts", async () => {
    const client = new TestClient();
    for (let i = 0; i < 30; i += 1) await client.signIn(uniqueEmail("spray"), "whatever-password");
    const { users } = await makeOrganization();
    expect((await client.signIn(users.admin.email, factoryPassword)).error).toBe("too-many-attempts");
    expect((await new TestClient().signIn(users.admin.email, factoryPassword)).ok).toBe(true);
  });
});

describe("a password hashed at an older bcrypt cost", () => {
  // The test server hashes at BENCHFOLD_PASSWORD_HASH_COST (scripts/test.sh); a stored hash below
  // it is replaced on the next successful sign-in (lib/server/auth/auth-options.ts).
  const currentCost = Number(process.env.BENCHFOLD_PASSWORD_HASH_COST ?? 11);
  const { AuditEvent, User } = db();

  it("is rehashed at the current cost on a successful sign-in, and only then", async () => {
    const { users } = await makeOrganization();
    const password = "Cobalt-mixer-harmonic-77";
    const oldCost = currentCost - 1;
    const oldHash = bcrypt.hashSync(password, oldCost);
    await User.update({ passwordHash: oldHash }, { where: { id: users.engineer.id } });
    expect(bcrypt.getRounds(oldHash)).toBe(oldCost);

    // A wrong password changes nothing.
    expect((await new TestClient().signIn(users.engineer.email, "wrong-password-x")).error).toBe("invalid-credentials");
    expect((await User.findByPk(users.engineer.id))!.passwordHash).toBe(oldHash);

    const first = new TestClient();
    expect((await first.signIn(users.engineer.email, password)).ok).toBe(true);
    const rehashed = (await User.findByPk(users.engineer.id))!;
    expect(rehashed.passwordHash).not.toBe(oldHash);
    expect(bcrypt.getRounds(rehashed.passwordHash)).toBe(currentCost);
    expect(bcrypt.compareSync(password, rehashed.passwordHash)).toBe(true);
    expect(rehashed.tokenVersion, "the same password: no session ends").toBe(users.engineer.tokenVersion);
    expect((await first.request("/api/me")).status).toBe(200);
    const events = await AuditEvent.findAll({ where: { subjectType: "user", subjectId: String(users.engineer.id), action: "account.password-rehashed" } });
    expect(events.map((e) => [e.before, e.after])).toEqual([[{ bcryptCost: oldCost }, { bcryptCost: currentCost }]]);

    // The new hash signs in; a hash at the current cost is left as it is.
    expect((await new TestClient().signIn(users.engineer.email, password)).ok).toBe(true);
    expect((await User.findByPk(users.engineer.id))!.passwordHash).toBe(rehashed.passwordHash);
  });

  it("a hash at a higher cost than today's is kept", async () => {
    const { users } = await makeOrganization();
    const password = "Garnet-hybrid-quadrature-31";
    const higher = bcrypt.hashSync(password, currentCost + 1);
    await User.update({ passwordHash: higher }, { where: { id: users.reviewer.id } });
    expect((await new TestClient().signIn(users.reviewer.email, password)).ok).toBe(true);
    expect((await User.findByPk(users.reviewer.id))!.passwordHash).toBe(higher);
  });
});

describe("the address the sign-in limit counts", () => {
  const { SignInAttempt } = db();
  const attemptsFrom = async (email: string) => (await SignInAttempt.findAll({ where: { email }, order: [["id", "ASC"]] })).map((a) => a.ipAddress);

  it("is the socket's address for a peer that is not a trusted proxy, whatever X-Forwarded-For it sends", async () => {
    const remote = nonLoopbackBaseUrl();
    const peer = new URL(remote).hostname.replace(/^\[|\]$/g, "");
    const email = uniqueEmail("spoof");
    for (const spoofed of ["10.1.1.1", "127.0.0.1", "10.2.2.2, 10.3.3.3"]) {
      const client = new TestClient({ baseUrl: remote });
      const csrf = (await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string };
      const response = await client.request("/api/auth/callback/credentials", {
        form: { csrfToken: csrf.csrfToken, email, password: "not-the-password", json: "true" },
        headers: { "x-forwarded-for": spoofed, "x-benchfold-client-address": spoofed },
      });
      expect(response.status).toBeLessThan(500);
    }
    expect(await attemptsFrom(email)).toEqual([peer, peer, peer]);
  });

  it("is the right-most X-Forwarded-For hop when the peer is the trusted proxy (loopback in tests)", async () => {
    const email = uniqueEmail("proxied");
    const client = new TestClient();
    await client.signIn(email, "not-the-password");
    await client.request("/api/auth/callback/credentials", {
      form: { csrfToken: ((await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string }).csrfToken, email, password: "nope-nope-1", json: "true" },
      headers: { "x-forwarded-for": "127.0.0.1, 10.250.0.7" },
    });
    expect(await attemptsFrom(email)).toEqual([client.address, "10.250.0.7"]);
  });

  it("throttles a non-proxy peer after the per-address limit even if it changes X-Forwarded-For on every try", async () => {
    const remote = nonLoopbackBaseUrl();
    const { users } = await makeOrganization();
    const limit = Number(process.env.BENCHFOLD_SIGNIN_LIMIT_ADDRESS ?? 30);
    let result = { ok: true as boolean, error: null as string | null };
    for (let i = 0; i <= limit; i += 1) {
      const client = new TestClient({ baseUrl: remote });
      const email = i < limit ? uniqueEmail("spray") : users.admin.email;
      const password = i < limit ? "whatever-password" : factoryPassword;
      // TestClient sends its own random X-Forwarded-For on every request.
      result = await client.signIn(email, password);
    }
    expect(result).toEqual({ ok: false, error: "too-many-attempts" });
    expect((await new TestClient().signIn(users.admin.email, factoryPassword)).ok).toBe(true);
  });
});

describe("signing out ends the session on the server", () => {
  const copyOf = (client: TestClient) => {
    const copy = new TestClient();
    for (const [name, value] of client.cookies) copy.cookies.set(name, value);
    return copy;
  };

  it("refuses a copy of the signed-out cookie on the API and on a workspace page; the person's other sessions stay", async () => {
    const { users } = await makeOrganization();
    const laptop = new TestClient();
    const benchPc = new TestClient();
    expect((await laptop.signIn(users.engineer.email, factoryPassword)).ok).toBe(true);
    expect((await benchPc.signIn(users.engineer.email, factoryPassword)).ok).toBe(true);
    const stolen = copyOf(laptop);
    expect((await stolen.request("/api/me")).status).toBe(200);
    expect((await stolen.request("/devices")).status).toBe(200);

    const out = await laptop.request("/api/auth/sign-out", { method: "POST" });
    expect(out.status).toBe(303);
    expect(out.headers.get("location")).toBe("/");
    expect(out.headers.getSetCookie().some((c) => /^next-auth\.session-token=;.*Max-Age=0/i.test(c))).toBe(true);
    expect([...laptop.cookies.keys()].some((k) => k.endsWith("session-token"))).toBe(false);

    expect((await stolen.request("/api/me")).status).toBe(401);
    expect((await stolen.request("/api/devices")).status).toBe(401);
    const page = await stolen.request("/devices");
    expect(page.status).toBe(307);
    expect(page.headers.get("location")).toContain("/sign-in");

    expect((await benchPc.request("/api/me")).status).toBe(200);
    expect((await benchPc.request("/devices")).status).toBe(200);
    expect((await new TestClient().signIn(users.engineer.email, factoryPassword)).ok).toBe(true);
  });

  it("next-auth's own sign-out endpoint revokes the session too", async () => {
    const { users } = await makeOrganization();
    const client = new TestClient();
    expect((await client.signIn(users.reviewer.email, factoryPassword)).ok).toBe(true);
    const stolen = copyOf(client);
    const { csrfToken } = (await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const out = await client.request("/api/auth/signout", { form: { csrfToken, json: "true" } });
    expect(out.status).toBeLessThan(400);
    expect((await stolen.request("/api/me")).status).toBe(401);
  });

  it("refuses a sign-out posted from another site, and the session stays", async () => {
    const { users } = await makeOrganization();
    const client = new TestClient();
    expect((await client.signIn(users.admin.email, factoryPassword)).ok).toBe(true);
    const out = await client.request("/api/auth/sign-out", { method: "POST", origin: "https://elsewhere.example" });
    expect(out.status).toBe(403);
    expect((await client.request("/api/me")).status).toBe(200);
  });
});

describe("sessions follow the database", () => {
  const { AuditEvent } = db();
  it("a disabled user's existing session is refused on the next request", async () => {
    const { users } = await makeOrganization();
    const engineer = new TestClient();
    const admin = new TestClient();
    expect((await engineer.signIn(users.engineer.email, factoryPassword)).ok).toBe(true);
    expect((await admin.signIn(users.admin.email, factoryPassword)).ok).toBe(true);
    expect((await engineer.request("/api/devices")).status).toBe(200);

    const r = await admin.request(`/api/admin/users/${users.engineer.id}`, { method: "PATCH", json: { disabled: true } });
    expect(r.status).toBe(200);
    expect((await engineer.request("/api/devices")).status).toBe(401);
    expect((await new TestClient().signIn(users.engineer.email, factoryPassword)).ok).toBe(false);

    const events = await AuditEvent.findAll({ where: { subjectType: "user", subjectId: String(users.engineer.id), action: "user.update" } });
    expect(events.at(-1)?.before).toEqual({ role: "engineer", disabled: false });
    expect(events.at(-1)?.after).toEqual({ role: "engineer", disabled: true });
  });

  it("a role change takes effect on the user's next request", async () => {
    const { users } = await makeOrganization();
    const reviewer = new TestClient();
    const admin = new TestClient();
    await reviewer.signIn(users.reviewer.email, factoryPassword);
    await admin.signIn(users.admin.email, factoryPassword);
    expect((await reviewer.request("/api/admin/users")).status).toBe(403);
    await admin.request(`/api/admin/users/${users.reviewer.id}`, { method: "PATCH", json: { role: "admin" } });
    expect((await reviewer.request("/api/admin/users")).status).toBe(200);
  });

  it("an admin cannot disable themselves or remove the last admin", async () => {
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    const r = await admin.request(`/api/admin/users/${users.admin.id}`, { method: "PATCH", json: { disabled: true } });
    expect(r.status).toBe(409);
  });
});

describe("invitations by e-mail", () => {
  const { User } = db();
  it("sends an invitation the fake SMTP server catches, whose link creates the account once", async () => {
    const { organization, users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    const email = uniqueEmail("invitee");
    const created = await admin.request("/api/admin/invitations", { json: { email, role: "reviewer" } });
    expect(created.status).toBe(201);

    const mail = await waitForMail(email);
    expect(mail.subject).toContain(organization.name);
    const link = firstLink(mail.text);
    const token = link.pathname.split("/").pop()!;
    expect(link.pathname).toBe(`/invitations/${token}`);

    const visitor = new TestClient();
    const page = await visitor.request(link.pathname);
    expect(page.status).toBe(200);
    const preview = await visitor.request(`/api/invitations/${token}`);
    expect(await preview.json()).toMatchObject({ email, role: "reviewer", organizationName: organization.name });

    const accepted = await visitor.request("/api/invitations/accept", { json: { token, name: "New Reviewer", password: "a-good-password" } });
    expect(accepted.status).toBe(201);
    const user = await User.findOne({ where: { email } });
    expect(user).toMatchObject({ role: "reviewer", organizationId: organization.id });
    expect((await visitor.signIn(email, "a-good-password")).ok).toBe(true);

    const again = await new TestClient().request("/api/invitations/accept", { json: { token, name: "Twice", password: "a-good-password" } });
    expect(again.status).toBe(404);
  });

  it("refuses to invite a member of the organization (an account elsewhere: account-privacy.test.ts)", async () => {
    const { users } = await makeOrganization();
    const admin = new TestClient();
    await admin.signIn(users.admin.email, factoryPassword);
    const r = await admin.request("/api/admin/invitations", { json: { email: users.engineer.email, role: "engineer" } });
    expect(r.status).toBe(409);
  });
});

describe("password reset", () => {
  it("resets a password through the e-mailed link and ends old sessions", async () => {
    const { users } = await makeOrganization();
    const old = new TestClient();
    await old.signIn(users.customer.email, factoryPassword);
    expect((await old.request("/api/me")).status).toBe(200);

    expect((await new TestClient().request("/api/password-resets", { json: { email: users.customer.email } })).status).toBe(202);
    expect((await new TestClient().request("/api/password-resets", { json: { email: uniqueEmail("nobody") } })).status).toBe(202);
    const mail = await waitForMail(users.customer.email);
    const token = firstLink(mail.text).pathname.split("/").pop()!;
    const done = await new TestClient().request("/api/password-resets/complete", { json: { token, password: "brand-new-password" } });
    expect(done.status).toBe(200);

    expect((await old.request("/api/me")).status).toBe(401);
    expect((await new TestClient().signIn(users.customer.email, "brand-new-password")).ok).toBe(true);
    expect((await new TestClient().request("/api/password-resets/complete", { json: { token, password: "another-password" } })).status).toBe(404);
  });
});
