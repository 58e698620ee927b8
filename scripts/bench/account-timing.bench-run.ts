/**
 * Account timing benchmark (run by `npm run bench`, not by `npm test`): for sign-up, password
 * reset, sign-in and invitation, the median time of the server function for an address that has
 * an account against one that has none. The answers are compared in the integration tests
 * (tests/integration/account-privacy.test.ts); here only the time, and nothing is asserted on it.
 *
 * It needs the MariaDB instance (`npm run db:start`) with a migrated database: by default
 * benchfold_test, which every `npm test` run makes afresh; DB_NAME picks another. Mail goes to a
 * fake SMTP server started here, so both paths pay a real SMTP exchange. Sign-in attempts come
 * from addresses in 198.18.0.0/15 (RFC 2544's benchmarking range) and are removed afterwards.
 */
import { randomBytes } from "node:crypto";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const roundsPerCase = Number(process.env.BENCH_ACCOUNT_ROUNDS ?? 15);
/** The factor the two medians should stay within: loose, since the machine is shared. */
const looseFactor = 1.5;

it("times known against unknown addresses on sign-up, reset, sign-in and invitation", { timeout: 600_000 }, async () => {
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      stream.resume();
      stream.on("end", () => callback());
    },
  });
  await new Promise<void>((resolve) => smtp.listen(0, "127.0.0.1", resolve));
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String((smtp.server.address() as AddressInfo).port);
  process.env.BENCHFOLD_FAKE_SMTP = "1";
  process.env.DB_NAME ??= "benchfold_test";

  const { db, closeDb } = await import("@/models");
  const { Organization, User, SignUpRequest, sequelize } = db();
  try {
    await sequelize.authenticate();
    await SignUpRequest.count();
  } catch (error) {
    console.log(`account timing skipped: no migrated database ${process.env.DB_NAME} (${(error as Error).message.split("\n")[0]}); run npm run db:start, and npm test once`);
    smtp.close();
    expect(true).toBe(true);
    return;
  }

  const { signUpCustomer } = await import("@/lib/server/accounts/sign-up-customer");
  const { requestPasswordReset } = await import("@/lib/server/accounts/request-password-reset");
  const { hashPassword } = await import("@/lib/server/accounts/hash-password");
  const { createInvitation } = await import("@/lib/server/invitations/create-invitation");
  const { authOptions } = await import("@/lib/server/auth/auth-options");
  const authorize = (authOptions.providers[0] as unknown as { options: { authorize: (c: Record<string, string>, r: { headers: Record<string, string> }) => Promise<unknown> } }).options.authorize;

  const tag = randomBytes(4).toString("hex");
  const email = (label: string) => `${label}-${randomBytes(5).toString("hex")}@timing.example`;
  const inviting = await Organization.create({ slug: `timing-${tag}`, name: `Timing Org ${tag}`, kind: "vendor" });
  const elsewhere = await Organization.create({ slug: `timing-other-${tag}`, name: `Timing Other ${tag}`, kind: "lab" });
  const passwordHash = await hashPassword("timing bench password, never used");
  const admin = await User.create({ organizationId: inviting.id, email: email("admin"), name: "Timing Admin", role: "admin", passwordHash });
  // Four failed sign-ins per account at most, so the per-account lock (five) never answers instead.
  const known = [] as string[];
  for (let i = 0; i < roundsPerCase; i++) {
    known.push((await User.create({ organizationId: elsewhere.id, email: email("known"), name: `Known ${i}`, role: "engineer", passwordHash })).email);
  }
  const actor = { id: admin.id, email: admin.email, name: admin.name, role: "admin" as const, organizationId: inviting.id, organizationName: inviting.name, organizationKind: "vendor" as const };
  let address = 0;
  const nextAddress = () => `198.18.${(++address >> 8) & 255}.${address & 255}`;

  const cases: { name: string; run: (to: string, round: number) => Promise<unknown> }[] = [
    { name: "sign-up", run: (to) => signUpCustomer({ name: "Timing Person", email: to, password: "a long sentence for a password", company: "Timing Works" }, nextAddress()) },
    { name: "password reset", run: (to) => requestPasswordReset(to, nextAddress()) },
    {
      name: "sign-in, wrong password",
      run: (to) => authorize({ email: to, password: "not the password at all" }, { headers: { "x-forwarded-for": nextAddress() } }).catch((e: Error) => e.message),
    },
    { name: "invitation", run: (to) => createInvitation({ actor, input: { email: to, role: "engineer" } }) },
  ];

  const median = (xs: number[]) => {
    const s = [...xs].sort((a, b) => a - b);
    return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
  };
  const rows: string[][] = [];
  try {
    for (const c of cases) {
      await c.run(email("warm-up"), -1);
      const times = { known: [] as number[], unknown: [] as number[] };
      for (let round = 0; round < roundsPerCase; round++) {
        // Alternate which goes first, so a drift in the machine's load falls on both alike.
        const order = round % 2 ? (["unknown", "known"] as const) : (["known", "unknown"] as const);
        for (const which of order) {
          const to = which === "known" ? known[round] : email("unknown");
          const t0 = performance.now();
          await c.run(to, round);
          times[which].push(performance.now() - t0);
        }
      }
      const k = median(times.known);
      const u = median(times.unknown);
      const factor = Math.max(k, u) / Math.min(k, u);
      rows.push([c.name, k.toFixed(1), u.toFixed(1), factor.toFixed(2), factor <= looseFactor ? "yes" : "NO"]);
    }
  } finally {
    await sequelize.query("DELETE FROM sign_in_attempts WHERE ip_address LIKE '198.18.%'");
    smtp.close();
    await closeDb();
  }

  const header = ["case", "known ms", "unknown ms", "factor", `within ${looseFactor}×`];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => r.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join("  ");
  console.log(`\nAccount timing: median of ${roundsPerCase} rounds per case, an address with an account (known) against one without (unknown), database ${process.env.DB_NAME}`);
  console.log([line(header), ...rows.map(line)].join("\n"));
  console.log("factor = slower median ÷ faster median; both paths hash or compare one bcrypt password and send one mail.");
  expect(rows).toHaveLength(cases.length);
});
