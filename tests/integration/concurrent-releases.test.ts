import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { closeDb } from "@/models";
import type { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { deviceWithApprovedData, release, sign, submitDraft } from "./helpers/reviews";

// First releases of different devices at the same moment, in two organizations. Each release's
// transaction reads the device's latest revision FOR UPDATE; with none there yet, InnoDB locks the
// gap of the device index where it would be, the same gap for every device newer than all released
// ones, and both transactions then insert into it: one is chosen as the deadlock victim. The
// demo loader hit this (a 500); the release now runs again when InnoDB rolls it back.

const orgs: { clients: Map<Who, TestClient>; candidates: number[] }[] = [];
afterAll(() => closeDb());

beforeAll(async () => {
  for (const kind of ["vendor", "lab"] as const) {
    const made = await makeOrganization(kind);
    const clients = await clientsByRole(made);
    const engineer = clients.get("engineer")!;
    const reviewer = clients.get("reviewer")!;
    const candidates: number[] = [];
    for (let i = 0; i < 2; i++) {
      const deviceId = await deviceWithApprovedData(made.organization.id, engineer, reviewer);
      const candidate = await submitDraft(engineer, deviceId);
      const signed = await sign(reviewer, candidate.id);
      expect(signed.status, await signed.clone().text()).toBe(200);
      candidates.push(candidate.id);
    }
    orgs.push({ clients, candidates });
  }
}, 240_000);

describe("concurrent first releases", () => {
  it("of four devices in two organizations all answer 201 with revision A, none 500", async () => {
    const answers = await Promise.all(orgs.flatMap(({ clients, candidates }) => candidates.map((id) => release(clients.get("engineer")!, id))));
    const bodies = await Promise.all(answers.map(async (r) => ({ status: r.status, body: (await r.json()) as { revision?: RevisionSummary; error?: { message: string } } })));
    expect(bodies.map((b) => [b.status, b.body.revision?.letter ?? b.body.error?.message])).toEqual(bodies.map(() => [201, "A"]));
    expect(new Set(bodies.map((b) => b.body.revision!.deviceId)).size).toBe(4);
  }, 120_000);
});
