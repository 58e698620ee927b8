import { afterEach, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const saved = process.env.NEXTAUTH_URL;
afterEach(() => {
  if (saved === undefined) delete process.env.NEXTAUTH_URL;
  else process.env.NEXTAUTH_URL = saved;
  vi.resetModules();
});

async function optionsFor(url: string) {
  process.env.NEXTAUTH_URL = url;
  vi.resetModules();
  return (await import("@/lib/server/auth/auth-options")).authOptions;
}

// The HTTPS case cannot be read from the plain-HTTP test server: the option that decides it is
// checked here, the cookies it produces over HTTP in tests/integration/headers.test.ts.
describe("session cookies follow NEXTAUTH_URL's scheme", () => {
  it.each([
    ["https://sheets.example", true],
    ["http://localhost:3000", false],
  ])("%s → useSecureCookies %s", async (url, secure) => {
    expect((await optionsFor(url)).useSecureCookies).toBe(secure);
  });
});
