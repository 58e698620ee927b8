/**
 * The README's examples run as a newcomer types them: every `sh` block that posts to the bench
 * API or runs the CLI is executed here, unchanged except for the server's address.
 */
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import { beforeAll, describe, expect, it } from "vitest";
import { demoUploads } from "@/models/seeders/demo-measurements";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { baseUrl } from "./helpers/loopback";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const README = readFileSync(path.join(ROOT, "README.md"), "utf8");
const README_ORIGIN = "http://localhost:3000";

/** The README's fenced `sh` blocks, in order. */
function shellBlocks(markdown: string): string[] {
  return [...markdown.matchAll(/```sh\n([\s\S]*?)```/g)].map((m) => m[1]);
}

const benchBlock = shellBlocks(README).find((block) => block.includes("/api/v1/measurements"));
const cliLines = shellBlocks(README)
  .flatMap((block) => block.split("\n"))
  .filter((line) => line.startsWith("npm run benchfold"));

const sha256 = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");

describe("README", () => {
  it("has a bench-upload example and CLI examples to run", () => {
    expect(benchBlock).toBeDefined();
    expect(benchBlock).toContain(README_ORIGIN);
    expect(cliLines.length).toBeGreaterThanOrEqual(2);
  });

  it("posts a file the demo does not already hold (else a fresh npm start answers 409)", () => {
    const file = /file=@(\S+)/.exec(benchBlock!)?.[1];
    expect(file).toBeDefined();
    const readmeHash = sha256(readFileSync(path.join(ROOT, file!)));
    const demoHashes = new Set(demoUploads.map((upload) => sha256(upload.bytes())));
    expect(demoHashes.has(readmeHash)).toBe(false);
  });

  describe("the bench upload, against an organization with the README's device", () => {
    let token = "";
    beforeAll(async () => {
      const made = await makeOrganization();
      await makeDevice(made.organization.id, /device=(\S+)/.exec(benchBlock!)![1]);
      const admin = new TestClient();
      expect((await admin.signIn(made.users.admin.email, factoryPassword)).ok).toBe(true);
      const created = await admin.request("/api/admin/bench-tokens", { json: { name: "README example" } });
      expect(created.status).toBe(201);
      token = ((await created.json()) as { token: string }).token;
    });

    const post = () =>
      run("bash", ["-euo", "pipefail", "-c", benchBlock!.replaceAll(README_ORIGIN, baseUrl)], {
        cwd: ROOT,
        env: { ...process.env, BENCHFOLD_BENCH_TOKEN: token },
      });

    it("answers 201 with a submitted measurement set, then 409 for the same bytes, as the README says", async () => {
      const first = await post();
      const body = JSON.parse(first.stdout) as { measurementSet: { state: string; conditions: { serial: string } } };
      expect(body.measurementSet.state).toBe("submitted");
      expect(body.measurementSet.conditions.serial).toBe("BFD-0006");
      // curl -f exits 22 on an HTTP error status; -S prints the status it got.
      await expect(post()).rejects.toMatchObject({ code: 22, stderr: expect.stringContaining("409") });
    });
  });

  it.each(cliLines.map((line) => [line]))("runs `%s`", async (line) => {
    const command = line.replace(/\s+#.*$/, "");
    const { stdout } = await run("bash", ["-euo", "pipefail", "-c", command], { cwd: ROOT });
    if (command.includes("--json")) expect(JSON.parse(stdout.slice(stdout.indexOf("{")))).toHaveProperty("parameters");
    else expect(stdout).toMatch(/\d+ parameters/);
  });
});
