import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import type { Device } from "@/models";
import { demoPassword } from "@/models/seeders/demo-scenario";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";

// Security headers read back from the built app's real responses: proxy.ts (the per-request
// Content-Security-Policy), next.config.mjs (headers on every response), lib/server/auth/guard.ts
// (no-store on route handlers' answers) and next-auth's cookies (lib/server/auth/auth-options.ts).

let anonymous: TestClient;
let engineer: TestClient;
let admin: TestClient;
let demoEngineer: TestClient;
let demoEngineerEmail: string;
let deviceId: number;
let factoryDevice: Device;

beforeAll(async () => {
  const { Device, Organization, User } = db();
  const made = await makeOrganization();
  factoryDevice = await makeDevice(made.organization.id);
  anonymous = new TestClient();
  engineer = new TestClient();
  admin = new TestClient();
  expect((await engineer.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
  expect((await admin.signIn(made.users.admin.email, factoryPassword)).ok).toBe(true);
  // A demo device with approved data: its pages draw charts and its PDF has content.
  const kestrine = await Organization.findOne({ where: { slug: "kestrine" } });
  deviceId = (await Device.findOne({ where: { organizationId: kestrine!.id, partNumber: "KDX-2G4" } }))!.id;
  demoEngineerEmail = (await User.findOne({ where: { organizationId: kestrine!.id, role: "engineer" } }))!.email;
  demoEngineer = new TestClient();
  expect((await demoEngineer.signIn(demoEngineerEmail, demoPassword)).ok).toBe(true);
});
afterAll(() => closeDb());

/** `directive → sources`, as a browser splits a policy (CSP Level 3, "parse a serialized CSP"). */
function parsePolicy(header: string | null): Map<string, string[]> {
  expect(header, "Content-Security-Policy header").toBeTruthy();
  const directives = new Map<string, string[]>();
  for (const part of header!.split(";")) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) directives.set(name.toLowerCase(), sources);
  }
  return directives;
}

function nonceOf(policy: Map<string, string[]>): string {
  const sources = policy.get("script-src") ?? [];
  const nonces = sources.filter((s) => s.startsWith("'nonce-")).map((s) => s.slice("'nonce-".length, -1));
  expect(nonces, "one nonce in script-src").toHaveLength(1);
  return nonces[0];
}

/** What every response carries, whatever made it. */
function expectBaseHeaders(response: Response, what: string): void {
  expect(response.headers.get("x-content-type-options"), `${what}: nosniff`).toBe("nosniff");
  expect(response.headers.get("referrer-policy"), `${what}: Referrer-Policy`).toBe("same-origin");
  expect(response.headers.get("x-frame-options"), `${what}: X-Frame-Options`).toBe("DENY");
}

/** A page: the base headers plus the nonce policy, every directive as specified. */
function expectPagePolicy(response: Response, what: string): string {
  expectBaseHeaders(response, what);
  const policy = parsePolicy(response.headers.get("content-security-policy"));
  const nonce = nonceOf(policy);
  expect(nonce, `${what}: a nonce of 16 random bytes, base64`).toMatch(/^[A-Za-z0-9+/]{22}==$/);
  expect(Object.fromEntries(policy), what).toEqual({
    "default-src": ["'self'"],
    "script-src": ["'self'", `'nonce-${nonce}'`, "'strict-dynamic'"],
    "style-src": ["'self'", "'unsafe-inline'"],
    "img-src": ["'self'", "data:", "blob:"],
    "font-src": ["'self'"],
    "connect-src": ["'self'"],
    "frame-src": ["'self'", "blob:"],
    "object-src": ["'none'"],
    "base-uri": ["'self'"],
    "form-action": ["'self'"],
    "frame-ancestors": ["'none'"],
  });
  return nonce;
}

/**
 * A route handler's answer (JSON, PDF, next-auth's own pages): the base headers plus the policy
 * that lets nothing load (next.config.mjs), the same on success, refusal and error.
 */
function expectRouteHandlerPolicy(response: Response, what: string): void {
  expectBaseHeaders(response, what);
  const policy = parsePolicy(response.headers.get("content-security-policy"));
  expect(Object.fromEntries(policy), `${what}: Content-Security-Policy`).toEqual({
    "default-src": ["'none'"],
    "style-src": ["'unsafe-inline'"],
    "form-action": ["'self'"],
    "base-uri": ["'none'"],
    "frame-ancestors": ["'none'"],
  });
}

/** Every <script> in the HTML carries the header's nonce (Next stamps it while rendering). */
function expectScriptsCarry(html: string, nonce: string, what: string): void {
  const tags = html.match(/<script\b[^>]*>/g) ?? [];
  expect(tags.length, `${what}: scripts on the page`).toBeGreaterThan(3);
  for (const tag of tags) expect(tag, what).toContain(`nonce="${nonce}"`);
}

describe("pages", () => {
  it.each([
    ["the home page", "/"],
    ["the catalog", "/catalog"],
    ["sign-in", "/sign-in"],
  ])("%s (signed out) sends the nonce policy, and its scripts carry the nonce", async (what, path) => {
    const r = await anonymous.request(path);
    expect(r.status).toBe(200);
    const nonce = expectPagePolicy(r, what);
    expectScriptsCarry(await r.text(), nonce, what);
  });

  it("a workspace page with charts (device page, signed in) does too", async () => {
    const r = await demoEngineer.request(`/devices/${deviceId}`);
    expect(r.status).toBe(200);
    const nonce = expectPagePolicy(r, "device page");
    expectScriptsCarry(await r.text(), nonce, "device page");
  });

  it("the sheet workspace (PDF preview in a blob: frame) does too", async () => {
    const r = await demoEngineer.request(`/sheets/${deviceId}`);
    expect(r.status).toBe(200);
    const nonce = expectPagePolicy(r, "sheet page");
    expectScriptsCarry(await r.text(), nonce, "sheet page");
  });

  it("a refused page (403) and a missing one (404) are covered as well", async () => {
    const refused = await engineer.request("/admin/users");
    expect(refused.status).toBe(403);
    expectPagePolicy(refused, "403 page");
    const missing = await anonymous.request("/no-such-page");
    expect(missing.status).toBe(404);
    expectScriptsCarry(await missing.text(), expectPagePolicy(missing, "404 page"), "404 page");
  });

  it("Next's prebuilt global error page is not served by its address (its scripts would carry no nonce)", async () => {
    // Next draws the global error per request, with the nonce, inside a failing page's own
    // response; /_global-error itself was the build's HTML without one (answered 500).
    const r = await anonymous.request("/_global-error");
    expect(r.status).toBe(404);
    expectScriptsCarry(await r.text(), expectPagePolicy(r, "/_global-error"), "/_global-error");
  });

  it("two loads of the same page get different nonces", async () => {
    const nonces = new Set<string>();
    for (let i = 0; i < 2; i++) {
      const r = await anonymous.request("/");
      nonces.add(nonceOf(parsePolicy(r.headers.get("content-security-policy"))));
      await r.arrayBuffer();
    }
    expect(nonces.size).toBe(2);
  });
});

describe("route handlers", () => {
  it("JSON behind a session: no-store and the route handlers' policy on success and on errors", async () => {
    const ok = await engineer.request("/api/devices");
    expect(ok.status).toBe(200);
    expectRouteHandlerPolicy(ok, "GET /api/devices");
    expect(ok.headers.get("cache-control")).toBe("no-store");
    expect(ok.headers.get("content-type")).toMatch(/^application\/json/);

    const signedOut = await anonymous.request("/api/devices");
    expect(signedOut.status).toBe(401);
    expectRouteHandlerPolicy(signedOut, "401");
    expect(signedOut.headers.get("cache-control")).toBe("no-store");

    const invalid = await engineer.request("/api/devices", { json: { partNumber: "" } });
    expect(invalid.status).toBe(422);
    expectRouteHandlerPolicy(invalid, "422");
    expect(invalid.headers.get("cache-control")).toBe("no-store");

    const created = await engineer.request("/api/devices", {
      json: { partNumber: `HDR-${Date.now()}`, deviceClass: "frequency-multiplier", title: "Header check doubler", description: "", keyConditions: { multiplicationFactor: 2 } },
    });
    expect(created.status, await created.clone().text()).toBe(201);
    expect(created.headers.get("cache-control")).toBe("no-store");
    expectRouteHandlerPolicy(created, "201");
  });

  it("JSON behind a bench token: no-store on success and on errors", async () => {
    const madeToken = await admin.request("/api/admin/bench-tokens", { json: { name: "Header check bench" } });
    expect(madeToken.status).toBe(201);
    expect(madeToken.headers.get("cache-control"), "the new token's one showing").toBe("no-store");
    const { token } = (await madeToken.json()) as { token: string };

    const bench = new TestClient();
    const posted = await bench.request("/api/v1/measurements", {
      multipart: fixtureUpload("examples/two-tone-mixer.tsv", { device: factoryDevice.partNumber }),
      headers: { authorization: `Bearer ${token}` },
      origin: null,
    });
    expect(posted.status, await posted.clone().text()).toBe(201);
    expectRouteHandlerPolicy(posted, "bench upload");
    expect(posted.headers.get("cache-control")).toBe("no-store");

    const refused = await bench.request("/api/v1/measurements", { multipart: new FormData(), headers: { authorization: "Bearer bfd_not-a-token" }, origin: null });
    expect(refused.status).toBe(401);
    expectRouteHandlerPolicy(refused, "bench upload refused");
    expect(refused.headers.get("cache-control")).toBe("no-store");
  });

  it("next-auth's session answer is not stored either", async () => {
    const r = await engineer.request("/api/auth/session");
    expect(r.status).toBe(200);
    expectRouteHandlerPolicy(r, "GET /api/auth/session");
    expect(r.headers.get("cache-control")).toMatch(/\bno-store\b/);
  });

  it("the draft PDF keeps its private, revalidated caching (ETag → 304) with the base headers", async () => {
    const r = await demoEngineer.request(`/api/devices/${deviceId}/sheet/pdf`);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toBe("application/pdf");
    expectRouteHandlerPolicy(r, "PDF");
    expect(r.headers.get("cache-control")).toBe("private, no-cache");
    const etag = r.headers.get("etag");
    expect(etag).toMatch(/^W\/".+"$/);
    await r.arrayBuffer();
    const again = await demoEngineer.request(`/api/devices/${deviceId}/sheet/pdf`, { headers: { "if-none-match": etag! } });
    expect(again.status).toBe(304);
    expectRouteHandlerPolicy(again, "PDF 304");
    expect(again.headers.get("cache-control")).toBe("private, no-cache");
  });
});

describe("route handlers (continued)", () => {
  it("a released sheet's public PDF and JSON carry the policy too", async () => {
    const pdf = await anonymous.request("/api/v1/sheets/kestrine/KDX-2G4/current/pdf");
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expectRouteHandlerPolicy(pdf, "released PDF");
    await pdf.arrayBuffer();
    const json = await anonymous.request("/api/v1/sheets/kestrine/KDX-2G4/current");
    expect(json.status).toBe(200);
    expectRouteHandlerPolicy(json, "released sheet JSON");
    const missing = await anonymous.request("/api/v1/sheets/kestrine/NO-SUCH-PART/current/pdf");
    expect(missing.status).toBe(404);
    expectRouteHandlerPolicy(missing, "released PDF 404");
  });

  it("next-auth's own HTML (its sign-out page) and an /api address with no handler (Next's 404 page)", async () => {
    const signOutPage = await engineer.request("/api/auth/signout");
    expect(signOutPage.status).toBe(200);
    expect(signOutPage.headers.get("content-type")).toMatch(/^text\/html/);
    expectRouteHandlerPolicy(signOutPage, "next-auth sign-out page");
    expect(await signOutPage.text()).toMatch(/<form[^>]+method="POST"/i);

    const nothing = await anonymous.request("/api/no-such-endpoint");
    expect(nothing.status).toBe(404);
    expectRouteHandlerPolicy(nothing, "/api 404");
    await nothing.arrayBuffer();
  });
});

describe("static files", () => {
  it("a script under /_next/static keeps its immutable public caching and gets the base headers", async () => {
    const html = await (await anonymous.request("/")).text();
    const src = /<script[^>]+src="(\/_next\/static\/[^"]+\.js)"/.exec(html)?.[1];
    expect(src, "a /_next/static script on the home page").toBeTruthy();
    const r = await anonymous.request(src!);
    expect(r.status).toBe(200);
    expectBaseHeaders(r, src!);
    expect(r.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    expect(r.headers.get("content-type")).toMatch(/javascript/);
  });
});

describe("cookies", () => {
  it("over plain HTTP (the test server) the session cookie is HttpOnly and SameSite=Lax, and marked Secure only under HTTPS", async () => {
    const client = new TestClient();
    const csrf = await client.request("/api/auth/csrf");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const r = await client.request("/api/auth/callback/credentials", {
      form: { csrfToken, email: demoEngineerEmail, password: demoPassword, json: "true" },
    });
    const session = r.headers.getSetCookie().find((line) => /next-auth\.session-token=/.test(line));
    expect(session, "a session cookie").toBeTruthy();
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    // NEXTAUTH_URL is http:// here, so useSecureCookies is false: no Secure flag, no __Secure- prefix.
    // The https:// case is tests/unit/auth/secure-cookies.test.ts.
    const secure = new URL(process.env.NEXTAUTH_URL ?? "http://localhost").protocol === "https:";
    expect(/;\s*Secure/i.test(session!)).toBe(secure);
    expect(session!.startsWith("__Secure-")).toBe(secure);
  });
});
