/**
 * Two app instances on one database behave as one. The run's server (instance A) and a second one
 * this test starts from the same build on TEST_SECOND_PORT (default: the test port + 100), as a
 * load balancer's pool would have them: the same public URL (NEXTAUTH_URL), and next-auth's secret
 * read from the database by scripts/instance-secret.ts in a process of its own, as a second host
 * would, never inherited. A session made on one is honoured by the other; a measurement set
 * uploaded on B is reviewed, signed and submitted across them; both release the one candidate at
 * the same moment: one revision. Also here: the database lock migrations and seeding run under.
 */
import { execFile, spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, createSequelize, db, withDatabaseLock } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { assertLoopbackDatabase, baseUrl } from "./helpers/loopback";
import { addApprovedSet, release, sign, submitDraft } from "./helpers/reviews";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const secondPort = Number(process.env.TEST_SECOND_PORT ?? Number(new URL(baseUrl).port) + 100);
const secondUrl = `http://localhost:${secondPort}`;
let second: ChildProcess | undefined;
let secondLog = "";

/** The secret a freshly started host gets: scripts/instance-secret.ts, with no NEXTAUTH_SECRET of its own. */
async function secretAsAnotherHostReadsIt(): Promise<string> {
  const env = { ...process.env };
  delete env.NEXTAUTH_SECRET;
  return (await run(process.execPath, ["node_modules/tsx/dist/cli.mjs", "scripts/instance-secret.ts"], { cwd: ROOT, env })).stdout;
}

beforeAll(async () => {
  assertLoopbackDatabase();
  const secret = await secretAsAnotherHostReadsIt();
  expect(secret, "npm test's server uses the secret made in the database").toBe(process.env.NEXTAUTH_SECRET);
  second = spawn(process.execPath, ["scripts/server.mjs"], {
    cwd: ROOT,
    env: { ...process.env, PORT: String(secondPort), NEXTAUTH_SECRET: secret },
    stdio: ["ignore", "pipe", "pipe"],
  });
  second.stdout!.on("data", (chunk) => (secondLog += chunk));
  second.stderr!.on("data", (chunk) => (secondLog += chunk));
  const until = Date.now() + 60_000;
  for (;;) {
    const ready = await fetch(`${secondUrl}/api/health/ready`).catch(() => null);
    if (ready?.ok) break;
    if (Date.now() > until || second.exitCode !== null) throw new Error(`the second instance did not get ready on ${secondUrl}:\n${secondLog}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}, 90_000);

afterAll(async () => {
  if (second && second.exitCode === null) {
    second.kill("SIGTERM");
    await new Promise((resolve) => second!.once("exit", resolve));
  }
  await closeDb();
});

/** A client of instance B carrying the session cookies a sign-in on instance A set. */
function onSecond(signedInOnFirst: TestClient): TestClient {
  const client = new TestClient({ baseUrl: secondUrl });
  for (const [name, value] of signedInOnFirst.cookies) client.cookies.set(name, value);
  return client;
}

describe("two instances on one database", () => {
  it("honour each other's sessions, and release one candidate from both at once as one revision", async () => {
    const made = await makeOrganization();
    const engineerA = new TestClient();
    expect((await engineerA.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
    const reviewerB = new TestClient({ baseUrl: secondUrl });
    expect((await reviewerB.signIn(made.users.reviewer.email, factoryPassword)).ok).toBe(true);

    const engineerB = onSecond(engineerA);
    const session = await engineerB.request("/api/auth/session");
    expect(((await session.json()) as { user?: { email?: string } }).user?.email).toBe(made.users.engineer.email);
    const stranger = new TestClient({ baseUrl: secondUrl });
    stranger.cookies.set("next-auth.session-token", "not-a-token");
    expect(((await (await stranger.request("/api/auth/session")).json()) as { user?: unknown }).user).toBeUndefined();

    const device = await makeDevice(made.organization.id);
    await addApprovedSet(device.id, engineerB, reviewerB); // uploaded on B with A's session, reviewed on B
    const candidate = await submitDraft(engineerA, device.id);
    const signed = await sign(reviewerB, candidate.id);
    expect(signed.status, await signed.clone().text()).toBe(200);

    const answers = await Promise.all([release(engineerA, candidate.id), release(engineerB, candidate.id)]);
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 201), JSON.stringify(statuses)).toHaveLength(1);
    const refused = statuses.find((s) => s !== 201)!;
    expect(refused >= 400 && refused < 500, `the other release answered ${refused}`).toBe(true);
    const revisions = await db().sequelize.query<{ letter: string }>("SELECT letter FROM sheet_revisions WHERE device_id = :id", {
      type: QueryTypes.SELECT,
      replacements: { id: device.id },
    });
    expect(revisions.map((r) => r.letter)).toEqual(["A"]);
  }, 120_000);
});

describe("the database lock migrations and seeding run under", () => {
  it("lets one holder at a time in, across connections, and gives up after its timeout", async () => {
    const one = createSequelize();
    const other = createSequelize();
    try {
      const events: string[] = [];
      const holder = (sequelize: typeof one, name: string) =>
        withDatabaseLock(sequelize, "two-instances-test", 10, async () => {
          events.push(`${name} in`);
          await new Promise((resolve) => setTimeout(resolve, 300));
          events.push(`${name} out`);
        });
      await Promise.all([holder(one, "first"), new Promise((resolve) => setTimeout(resolve, 50)).then(() => holder(other, "second"))]);
      expect(events).toEqual(["first in", "first out", "second in", "second out"]);

      let release!: () => void;
      const held = withDatabaseLock(one, "two-instances-test", 10, () => new Promise<void>((resolve) => (release = resolve)));
      await new Promise((resolve) => setTimeout(resolve, 100));
      await expect(withDatabaseLock(other, "two-instances-test", 1, async () => "never")).rejects.toThrow(/held the database lock .* for more than 1 s/);
      release();
      await held;
      await expect(withDatabaseLock(other, "two-instances-test", 1, async () => "free again")).resolves.toBe("free again");
    } finally {
      await Promise.all([one.close(), other.close()]);
    }
  });
});
