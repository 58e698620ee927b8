import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { db, closeDb } from "@/models";
import { demoOrganizations } from "@/models/seeders/demo-scenario";
import { assertLoopbackDatabase } from "./helpers/loopback";
import { makeOrganization } from "./helpers/factories";
import { demoCatalogParts } from "@/models/seeders/demo-catalog";

beforeAll(() => assertLoopbackDatabase());
afterAll(() => closeDb());

describe("migrations and demo seed on MariaDB", () => {
  const { AuditEvent, Device, Organization, User, sequelize } = db();
  it("applied every migration and seeder once", async () => {
    const migrations = await sequelize.query<{ name: string }>("SELECT name FROM benchfold_migrations", { type: QueryTypes.SELECT });
    const seeds = await sequelize.query<{ name: string }>("SELECT name FROM benchfold_seeds", { type: QueryTypes.SELECT });
    expect(migrations.map((m) => m.name)).toContain("20261201-0001-accounts-and-devices.ts");
    expect(seeds.map((s) => s.name)).toContain("20261201-0001-demo-organizations.ts");
  });

  it("seeded every demo organization, person and device", async () => {
    for (const spec of demoOrganizations) {
      const org = await Organization.findOne({ where: { slug: spec.slug } });
      expect(org, spec.slug).not.toBeNull();
      expect(await User.count({ where: { organizationId: org!.id } })).toBeGreaterThanOrEqual(spec.users.length);
      // The scenario's devices, and the demo catalog's parts the loader adds through the API (scripts/seed-demo-catalog.ts).
      const catalogParts = demoCatalogParts.filter((p) => p.org === spec.slug).length;
      expect(await Device.count({ where: { organizationId: org!.id } })).toBe(spec.devices.length + catalogParts);
    }
    const kestrine = await Organization.findOne({ where: { slug: "kestrine" } });
    const roles = (await User.findAll({ where: { organizationId: kestrine!.id } })).map((u) => u.role).sort();
    expect(roles).toEqual(["admin", "engineer", "reviewer"]);
  });

  it("returns counts and ids as numbers, so JSON serialisation never meets a BigInt", async () => {
    const [row] = await sequelize.query<{ n: unknown }>("SELECT COUNT(*) AS n FROM users", { type: QueryTypes.SELECT });
    expect(typeof row.n).toBe("number");
    expect(() => JSON.stringify(row)).not.toThrow();
  });

  it("round-trips objects, arrays, strings and null through JSON columns", async () => {
    const { organization } = await makeOrganization();
    const values: unknown[] = [{ a: 1, nested: { b: [1, 2] } }, [1, "two", null], "plain string", null, 42.5];
    for (const value of values) {
      const event = await AuditEvent.create({
        organizationId: organization.id, actorUserId: null, action: "test.json", subjectType: "test", subjectId: "1", before: value, after: null,
      });
      const back = await AuditEvent.findByPk(event.id);
      expect(back!.before).toEqual(value);
    }
  });

  it("keeps the audit trail append-only in the database itself", async () => {
    const event = await AuditEvent.create({ organizationId: null, actorUserId: null, action: "test.append", subjectType: "test", subjectId: "2", before: null, after: null });
    await expect(sequelize.query("UPDATE audit_events SET action = 'x' WHERE id = ?", { replacements: [event.id] })).rejects.toThrow(/append-only/);
    await expect(sequelize.query("DELETE FROM audit_events WHERE id = ?", { replacements: [event.id] })).rejects.toThrow(/append-only/);
  });

  it("enforces a unique part number per organization", async () => {
    const { organization } = await makeOrganization();
    await Device.create({ organizationId: organization.id, createdById: null, partNumber: "DUP-1", deviceClass: "quadrature-hybrid", title: "a", description: "", keyConditions: {} });
    await expect(
      Device.create({ organizationId: organization.id, createdById: null, partNumber: "DUP-1", deviceClass: "quadrature-hybrid", title: "b", description: "", keyConditions: {} }),
    ).rejects.toThrow();
  });
});

describe("demo measurement sets", () => {
  const { Device, Organization } = db();
  it("went in through the bench upload API, some approved and some pending", async () => {
    const { MeasurementSet } = (await import("@/models")).db();
    const kestrine = await Organization.findOne({ where: { slug: "kestrine" } });
    const sets = await MeasurementSet.findAll({ where: { organizationId: kestrine!.id } });
    expect(sets.length).toBeGreaterThanOrEqual(8);
    expect(new Set(sets.map((s) => s.source))).toEqual(new Set(["bench-api"]));
    expect(sets.filter((s) => s.state === "approved").length).toBeGreaterThan(0);
    expect(sets.filter((s) => s.state === "submitted").length).toBeGreaterThan(0);
    const doubler = await Device.findOne({ where: { organizationId: kestrine!.id, partNumber: "KDX-2G4" } });
    const serials = sets.filter((s) => s.deviceId === doubler!.id && s.kind === "drive-sweep").map((s) => s.conditions.serial);
    // BFD-0002 and BFD-0003 again at −40 and +85 °C; lot L2410's BFD-0011 and BFD-0012 at three temperatures and two more input frequencies.
    const l2410 = (serial: string) => Array<string>(5).fill(serial);
    expect(serials.sort()).toEqual([
      "BFD-0001", "BFD-0002", "BFD-0002", "BFD-0002", "BFD-0003", "BFD-0003", "BFD-0003", "BFD-0004", "BFD-0005",
      ...l2410("BFD-0011"), ...l2410("BFD-0012"), "BFD-0021",
    ]);
  });
});
