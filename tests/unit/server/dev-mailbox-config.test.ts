import { afterEach, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const { serverConfig } = await import("@/lib/server/config");

// The dev mailbox (and its API) exist only while mail is caught on this machine: the fake SMTP
// server is on, and both the SMTP host the app sends to and the fake's read-out are loopback
// (issue 14, fix 1). lib/server/mail/read-dev-mailbox.ts answers nothing when this is null.
const names = ["BENCHFOLD_FAKE_SMTP", "BENCHFOLD_MAILBOX_URL", "SMTP_HOST"] as const;
const saved = Object.fromEntries(names.map((n) => [n, process.env[n]]));
afterEach(() => {
  for (const n of names) {
    if (saved[n] === undefined) delete process.env[n];
    else process.env[n] = saved[n];
  }
});

function withEnv(env: Partial<Record<(typeof names)[number], string>>): string | null {
  for (const n of names) delete process.env[n];
  Object.assign(process.env, env);
  return serverConfig.mailboxUrl;
}

describe("serverConfig.mailboxUrl: the caught mail is readable only while it is caught locally", () => {
  it("is the read-out while the fake is on, sending to a loopback SMTP host", () => {
    expect(withEnv({ BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "http://127.0.0.1:2580", SMTP_HOST: "127.0.0.1" })).toBe("http://127.0.0.1:2580");
    expect(withEnv({ BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "http://localhost:2580" })).toBe("http://localhost:2580");
    expect(withEnv({ BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "http://[::1]:2580", SMTP_HOST: "::1" })).toBe("http://[::1]:2580");
  });

  it.each([
    ["the fake is not on", { BENCHFOLD_MAILBOX_URL: "http://127.0.0.1:2580", SMTP_HOST: "127.0.0.1" }],
    ["the fake flag is anything but 1", { BENCHFOLD_FAKE_SMTP: "true", BENCHFOLD_MAILBOX_URL: "http://127.0.0.1:2580" }],
    ["mail goes to a real relay", { BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "http://127.0.0.1:2580", SMTP_HOST: "smtp.relay.example" }],
    ["the read-out is on another machine", { BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "http://192.0.2.10:2580", SMTP_HOST: "127.0.0.1" }],
    ["the read-out address is not a URL", { BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_MAILBOX_URL: "not a url", SMTP_HOST: "127.0.0.1" }],
    ["there is no read-out", { BENCHFOLD_FAKE_SMTP: "1", SMTP_HOST: "127.0.0.1" }],
  ] as const)("is null when %s", (_, env) => {
    expect(withEnv(env)).toBeNull();
  });
});
