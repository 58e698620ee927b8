import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { makeOrganization } from "./helpers/factories";
import { baseUrl } from "./helpers/loopback";
import { firstLink, waitForMail } from "./helpers/mailbox";
import { nonLoopbackBaseUrl, rawRequest } from "./helpers/network";

afterAll(() => closeDb());

// The caught mail holds password-reset links: whoever reads it can take the account.
// It is served only to a request made on this machine, judged by the socket's address.
const port = new URL(baseUrl).port;
const loopback = `http://127.0.0.1:${port}`;
const paths = ["/api/dev/mailbox", "/dev/mailbox"];
let resetToken = "";

beforeAll(async () => {
  const { users } = await makeOrganization();
  const asked = await new TestClient().request("/api/password-resets", { json: { email: users.engineer.email } });
  expect(asked.status).toBe(202);
  resetToken = firstLink((await waitForMail(users.engineer.email)).text).pathname.split("/").pop()!;
  expect(resetToken.length).toBeGreaterThan(20);
});

describe("the dev mailbox", () => {
  it.each(paths)("%s shows the caught mail to a request from this machine (loopback, no proxy)", async (path) => {
    for (const url of [loopback, `http://localhost:${port}`]) {
      const r = await rawRequest(`${url}${path}`);
      expect(r.status, `${url}${path}`).toBe(200);
      expect(r.body).toContain(resetToken);
    }
  });

  it.each(paths)("%s is refused to a request from a non-loopback address, however it is dressed", async (path) => {
    const remote = nonLoopbackBaseUrl();
    const disguises: Record<string, string>[] = [
      {},
      { "X-Forwarded-For": "127.0.0.1" },
      { "X-Forwarded-For": "127.0.0.1", "X-Real-IP": "127.0.0.1", Forwarded: "for=127.0.0.1", Host: `localhost:${port}` },
      // Our internal headers, as a client might guess them: the server replaces them.
      { "X-Benchfold-Peer": "127.0.0.1", "X-Benchfold-Client-Address": "127.0.0.1", "X-Benchfold-Proxied": "0", Host: `localhost:${port}` },
    ];
    for (const headers of disguises) {
      const r = await rawRequest(`${remote}${path}`, headers);
      expect(r.status, `${remote}${path} with ${JSON.stringify(headers)}`).toBe(404);
      expect(r.body).not.toContain(resetToken);
    }
  });

  it.each(paths)("%s is refused to a loopback request relayed by a proxy or naming another host", async (path) => {
    const relayed: Record<string, string>[] = [
      { "X-Forwarded-For": "127.0.0.1" },
      { "X-Forwarded-For": "203.0.113.9" },
      { Forwarded: "for=127.0.0.1" },
      // A page on another site reaching 127.0.0.1 through DNS rebinding names its own host.
      { Host: `mail-reader.example:${port}` },
    ];
    for (const headers of relayed) {
      const r = await rawRequest(`${loopback}${path}`, headers);
      expect(r.status, `${path} with ${JSON.stringify(headers)}`).toBe(404);
      expect(r.body).not.toContain(resetToken);
    }
  });

  it("the running server's own log says plainly that mail is not being delivered", () => {
    // scripts/test.sh starts the server as npm start does, its output in this file.
    const log = readFileSync(path.join(process.env.BENCHFOLD_DATA_DIR ?? ".data", "logs", "next-test-server.log"), "utf8");
    expect(log).toContain("MAIL IS NOT BEING DELIVERED");
    expect(log).toMatch(/\/dev\/mailbox, only from this machine/);
  });

  it("the fake SMTP server's own read-out answers only this machine's requests by a loopback name", async () => {
    const readOut = `http://127.0.0.1:${process.env.BENCHFOLD_MAILBOX_PORT ?? 2581}/messages`;
    expect((await rawRequest(readOut)).status).toBe(200);
    expect((await rawRequest(readOut, { Host: "mail-reader.example" })).status).toBe(404);
    expect((await rawRequest(readOut, { "X-Forwarded-For": "203.0.113.9" })).status).toBe(404);
  });
});
