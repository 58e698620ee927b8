/**
 * The demo's conformity watch, played through the app's API after the demo's releases
 * (scripts/seed-demo-releases.ts): one unit of each of two released Kestrine parts is measured after
 * the release, uploaded by the engineer and approved by the reviewer, so the approval runs the watch.
 *
 * - KDX-2G4 (Rev. B, conversion loss ≤ 11 dB at 1 GHz): unit BFD-0021 from a new lot reads about
 *   2.5 dB more conversion loss than the first unit; its approval raises a conformity alert (outside the
 *   guaranteed limit, and far beyond 3σ of the release) and queues one notice per engineer and reviewer.
 * - KM-7H (Rev. A): unit BFD-0121 reads within a few hundredths of a dB of the first unit: in control,
 *   no alert.
 *
 * Each step looks first: a unit already uploaded is not uploaded again, one already approved is left
 * alone, and a part whose release is not there yet is skipped with a note, so a second run changes
 * nothing. Needs the app at BENCHFOLD_APP_URL. Run with `node node_modules/tsx/dist/cli.mjs
 * scripts/seed-demo-conformity.ts`, or call seedDemoConformity(appUrl) after seedDemoReleases.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import type { MeasurementSetSummary } from "../lib/domain/measurements";
import type { RevisionSummary } from "../lib/domain/reviews";
import { demoOrganizations, demoPassword } from "../models/seeders/demo-scenario";
import { signInOverHttp } from "./sign-in-over-http";

const examples = path.resolve(__dirname, "../fixtures/examples");

/** The example doubler as another unit: every output `dropDb` lower, so conversion loss is that much higher. */
function doublerUnit(serial: string, lot: string, dropDb: number): Buffer {
  const lines = readFileSync(path.join(examples, "drive-sweep-doubler.csv"), "utf8").split("\n");
  return Buffer.from(
    lines
      .map((line) => {
        if (line.startsWith("# serial:")) return `# serial: ${serial}`;
        if (line.startsWith("# lot:")) return `# lot: ${lot}`;
        if (!/^-?\d/.test(line)) return line;
        const [input, ...outs] = line.split(",");
        return [input, ...outs.map((v) => (Number(v) - dropDb).toFixed(2))].join(",");
      })
      .join("\n"),
  );
}

/** The example mixer as another unit: conversion loss and isolation moved by the given amounts (decimal comma kept). */
function mixerUnit(serial: string, lossShiftDb: number, isolationShiftDb: number): Buffer {
  const lines = readFileSync(path.join(examples, "frequency-sweep-mixer.csv"), "utf8").split("\n");
  const comma = (v: number) => v.toFixed(2).replace(".", ",");
  return Buffer.from(
    lines
      .map((line) => {
        if (line.startsWith("# serial:")) return `# serial: ${serial}`;
        if (!/^\d/.test(line)) return line;
        const [frequency, loss, isolation] = line.split(";");
        return [frequency, comma(Number(loss.replace(",", ".")) + lossShiftDb), comma(Number(isolation.replace(",", ".")) + isolationShiftDb)].join(";");
      })
      .join("\n"),
  );
}

export const demoConformityUnits = [
  { org: "kestrine", part: "KDX-2G4", serial: "BFD-0021", file: "drive-sweep-bfd-0021.csv", measuredOn: "2026-11-24", bytes: () => doublerUnit("BFD-0021", "L2611", 2.5), expect: "alert" },
  { org: "kestrine", part: "KM-7H", serial: "BFD-0121", file: "frequency-sweep-bfd-0121.csv", measuredOn: "2026-11-25", bytes: () => mixerUnit("BFD-0121", 0.04, -0.3), expect: "in control" },
] as const;

class Person {
  private constructor(
    private readonly appUrl: string,
    private readonly cookie: string,
  ) {}

  static async signIn(appUrl: string, org: string, role: "engineer" | "reviewer"): Promise<Person> {
    const user = demoOrganizations.find((o) => o.slug === org)?.users.find((u) => u.role === role);
    if (!user) throw new Error(`the demo organization ${org} has no ${role}`);
    return new Person(appUrl, await signInOverHttp(appUrl, { email: user.email, password: demoPassword }));
  }

  async call<T>(method: "GET" | "POST", path: string, body?: unknown | FormData, expected = method === "POST" ? 201 : 200): Promise<T> {
    const headers: Record<string, string> = { cookie: this.cookie, origin: new URL(this.appUrl).origin };
    if (body !== undefined && !(body instanceof FormData)) headers["content-type"] = "application/json";
    const r = await fetch(`${this.appUrl}${path}`, { method, headers, body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body) });
    const text = await r.text();
    if (r.status !== expected) throw new Error(`${method} ${path}: ${r.status} ${text.slice(0, 300)}`);
    return (text ? JSON.parse(text) : null) as T;
  }
}

/** Uploads and approves each unit the database does not show yet; what it did, one line each. */
export async function seedDemoConformity(appUrl: string): Promise<string[]> {
  const done: string[] = [];
  for (const unit of demoConformityUnits) {
    const engineer = await Person.signIn(appUrl, unit.org, "engineer");
    const reviewer = await Person.signIn(appUrl, unit.org, "reviewer");
    const { devices } = await engineer.call<{ devices: { id: number; partNumber: string }[] }>("GET", "/api/devices");
    const device = devices.find((d) => d.partNumber === unit.part);
    if (!device) throw new Error(`the demo device ${unit.part} is not there`);
    const { revisions } = await engineer.call<{ revisions: RevisionSummary[] }>("GET", `/api/devices/${device.id}/revisions`);
    if (!revisions.some((r) => r.standing === "current")) {
      done.push(`${unit.part} has no current revision yet: its conformity unit waits`);
      continue;
    }
    const { measurementSets } = await engineer.call<{ measurementSets: MeasurementSetSummary[] }>("GET", `/api/devices/${device.id}/measurements`);
    let set = measurementSets.find((s) => s.conditions.serial === unit.serial);
    if (!set) {
      const form = new FormData();
      form.set("file", new Blob([new Uint8Array(unit.bytes())]), unit.file);
      form.set("measuredOn", unit.measuredOn);
      set = (await engineer.call<{ measurementSet: MeasurementSetSummary }>("POST", `/api/devices/${device.id}/measurements`, form)).measurementSet;
    }
    if (set.state === "submitted") {
      await reviewer.call("POST", `/api/measurements/${set.id}/review`, { decision: "approve" }, 200);
      const { conformity } = await engineer.call<{ conformity: { alerts: { measurementSetId: number }[] } }>("GET", `/api/devices/${device.id}/conformity`);
      const raised = conformity.alerts.some((a) => a.measurementSetId === set.id);
      done.push(`${unit.part} unit ${unit.serial} approved after the release: ${raised ? "conformity alert raised" : "in control, no alert"} (expected: ${unit.expect})`);
    }
  }
  return done;
}

if (require.main === module) {
  const appUrl = process.env.BENCHFOLD_APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
  seedDemoConformity(appUrl)
    .then((played) => console.error(`[benchfold] demo conformity watch: ${played.length ? played.join("; ") : "already there"}`))
    .catch((error) => {
      console.error("[benchfold] demo conformity watch failed:", error instanceof Error ? error.message : error);
      process.exitCode = 1;
    });
}
