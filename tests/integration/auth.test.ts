import { afterAll, describe, expect, it } from "vitest";
import { AuditEvent, User, closeSequelize } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization, uniqueEmail } from "./helpers/factories";
import { firstLink, waitForMail } from "./helpers/mailbox";

afterAll(() => closeSequelize());

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

describe("sessions follow the database", () => {
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

describe("dev mailbox", () => {
  it("is served while the fake SMTP server runs", async () => {
    const r = await new TestClient().request("/api/dev/mailbox");
    expect(r.status).toBe(200);
  });
});
