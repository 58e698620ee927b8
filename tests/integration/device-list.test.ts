import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization } from "./helpers/factories";

let engineer: TestClient;

beforeAll(async () => {
  const { Device } = db();
  const made = await makeOrganization();
  const classes = ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"] as const;
  // 30 parts: SRT-1 … SRT-30 (natural order differs from text order), one with "%_" in its title.
  for (let i = 1; i <= 30; i++) {
    await Device.create({
      organizationId: made.organization.id,
      createdById: null,
      partNumber: `SRT-${i}`,
      deviceClass: classes[i % 3],
      title: i === 7 ? "Odd 100%_title" : `Sort test part ${i}`,
      description: "",
      keyConditions: {},
    });
  }
  engineer = new TestClient();
  expect((await engineer.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
});
afterAll(() => closeDb());

/** Part numbers in the order the devices table lists them. */
async function listed(query: string): Promise<string[]> {
  const r = await engineer.request(`/devices${query}`);
  expect(r.status).toBe(200);
  const html = await r.text();
  return [...html.matchAll(/href="\/devices\/\d+">(SRT-\d+)</g)].map((m) => m[1]);
}

describe("the device list, searched, sorted and paged by the database", () => {
  it("sorts part numbers naturally and pages by 25", async () => {
    const first = await listed("");
    expect(first).toHaveLength(25);
    expect(first.slice(0, 11)).toEqual(["SRT-1", "SRT-2", "SRT-3", "SRT-4", "SRT-5", "SRT-6", "SRT-7", "SRT-8", "SRT-9", "SRT-10", "SRT-11"]);
    expect(await listed("?page=2")).toEqual(["SRT-26", "SRT-27", "SRT-28", "SRT-29", "SRT-30"]);
    // A page past the end shows the last page.
    expect(await listed("?page=9")).toEqual(["SRT-26", "SRT-27", "SRT-28", "SRT-29", "SRT-30"]);
    expect((await listed("?dir=desc")).slice(0, 3)).toEqual(["SRT-30", "SRT-29", "SRT-28"]);
  });

  it("searches part number and title case-insensitively, with % and _ taken literally", async () => {
    expect(await listed("?q=srt-2")).toEqual(["SRT-2", "SRT-20", "SRT-21", "SRT-22", "SRT-23", "SRT-24", "SRT-25", "SRT-26", "SRT-27", "SRT-28", "SRT-29"]);
    expect(await listed(`?q=${encodeURIComponent("100%_")}`)).toEqual(["SRT-7"]);
    expect(await listed(`?q=${encodeURIComponent("%")}`)).toEqual(["SRT-7"]);
  });

  it("sorts by class label, then part number", async () => {
    const byClass = await listed("?sort=class&q=SRT-1");
    // SRT-1, SRT-10…SRT-19: classes by i % 3 (1 → mixer, 2 → hybrid, 0 → multiplier); labels
    // "Double-balanced mixer" < "Frequency multiplier" < "Quadrature hybrid or power splitter".
    expect(byClass).toEqual(["SRT-1", "SRT-10", "SRT-13", "SRT-16", "SRT-19", "SRT-12", "SRT-15", "SRT-18", "SRT-11", "SRT-14", "SRT-17"]);
  });
});
