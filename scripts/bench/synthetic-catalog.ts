/**
 * A synthetic catalog for the search benchmark: `devices` released devices of three invented
 * organizations across the device classes, written straight into the tables the search reads
 * (released_sheets, released_spec_values) and the rows they hang on (organizations, users,
 * devices, sheet_candidates, sheet_revisions, withdrawals). One revision per device, a later
 * revision B superseding A on every fifth, and one device in fifty withdrawn, so the default
 * "current revisions" filter has work to do. Spec rows follow each class's template (every row,
 * two condition groups: 25 °C and 85 °C) with seeded values. The frozen model and the PDF of these
 * revisions are placeholders: only the search reads this database.
 */
import { createHash } from "node:crypto";
import { QueryTypes, type Sequelize } from "sequelize";
import { deviceClasses, type DeviceClass } from "../../lib/domain/device-classes";
import { mulberry32 } from "../../lib/stats/seeded-random";
import { findSheetTemplate } from "../../templates";

export type SyntheticCatalog = { devices: number; revisions: number; specRows: number; current: number; organizations: string[] };

const organizations = [
  { slug: "corvane-microwave", name: "Corvane Microwave", kind: "vendor" },
  { slug: "tessaly-components", name: "Tessaly Components", kind: "vendor" },
  { slug: "halvard-rf-lab", name: "Halvard RF Laboratory", kind: "lab" },
] as const;

/** Typical value, spread and which limit a template row states, by its parameter (invented, plausible figures). */
const figures: Record<string, { typ: [number, number]; limit: "min" | "max"; margin: number }> = {
  "conversion-loss": { typ: [5, 12], limit: "max", margin: 1.5 },
  "insertion-loss": { typ: [0.2, 1.2], limit: "max", margin: 0.3 },
  "optimum-drive": { typ: [8, 17], limit: "max", margin: 2 },
  "harmonic-suppression": { typ: [15, 45], limit: "min", margin: 5 },
  isolation: { typ: [18, 45], limit: "min", margin: 5 },
  "input-p1db": { typ: [2, 20], limit: "min", margin: 2 },
  iip3: { typ: [10, 28], limit: "min", margin: 3 },
  "spot-phase-noise": { typ: [-152, -128], limit: "max", margin: 4 },
  "excess-over-ideal-multiplication": { typ: [0.3, 3], limit: "max", margin: 1 },
  "noise-floor-above-kt": { typ: [2, 12], limit: "max", margin: 2 },
  "worst-discrete-spur": { typ: [-100, -70], limit: "max", margin: 6 },
  vswr: { typ: [1.15, 1.8], limit: "max", margin: 0.3 },
  "amplitude-balance": { typ: [0.1, 0.6], limit: "max", margin: 0.3 },
  "phase-balance": { typ: [1, 5], limit: "max", margin: 2 },
};

const classCode: Record<string, string> = { "frequency-multiplier": "FM", "double-balanced-mixer": "MX", "quadrature-hybrid": "QH" };

async function insertRows(sequelize: Sequelize, table: string, columns: string[], rows: unknown[][]): Promise<void> {
  for (let i = 0; i < rows.length; i += 500) {
    const chunk = rows.slice(i, i + 500);
    const tuple = `(${columns.map(() => "?").join(", ")})`;
    await sequelize.query(`INSERT INTO ${table} (${columns.join(", ")}) VALUES ${chunk.map(() => tuple).join(", ")}`, { replacements: chunk.flat() });
  }
}

export async function seedSyntheticCatalog(sequelize: Sequelize, opts: { devices: number; seed?: number }): Promise<SyntheticCatalog> {
  const random = mulberry32(opts.seed ?? 20261202);
  const between = ([lo, hi]: [number, number]) => lo + (hi - lo) * random();
  const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;
  const now = new Date("2026-11-01T08:00:00Z");
  const classes = deviceClasses.filter((c) => classCode[c]) as DeviceClass[];

  const orgIds: number[] = [];
  const userIds: number[] = [];
  for (const org of organizations) {
    await sequelize.query("INSERT INTO organizations (slug, name, kind, created_at, updated_at) VALUES (?, ?, ?, NOW(3), NOW(3))", { replacements: [org.slug, org.name, org.kind] });
    const [{ id }] = await sequelize.query<{ id: number }>("SELECT id FROM organizations WHERE slug = ?", { type: QueryTypes.SELECT, replacements: [org.slug] });
    orgIds.push(id);
    await sequelize.query(
      "INSERT INTO users (organization_id, email, name, password_hash, role, created_at, updated_at) VALUES (?, ?, ?, ?, 'engineer', NOW(3), NOW(3))",
      { replacements: [id, `bench-${org.slug}@bench.example`, `Bench engineer of ${org.name}`, "!synthetic, cannot sign in"] },
    );
    const [user] = await sequelize.query<{ id: number }>("SELECT id FROM users WHERE organization_id = ?", { type: QueryTypes.SELECT, replacements: [id] });
    userIds.push(user.id);
  }

  type Planned = { n: number; org: number; deviceClass: DeviceClass; part: string; title: string; input: [number, number]; output: [number, number] | null; driveDbm: number | null; letters: string[] };
  const planned: Planned[] = [];
  for (let n = 0; n < opts.devices; n++) {
    const deviceClass = classes[n % classes.length];
    const startHz = round(between([0.5, 12]), 1) * 1e9;
    const input: [number, number] = [startHz, round(startHz * between([1.3, 2.2]) / 1e8, 0) * 1e8];
    const factor = n % 3 === 0 ? 3 : 2;
    const output: [number, number] | null = deviceClass === "frequency-multiplier" ? [input[0] * factor, input[1] * factor] : null;
    const driveDbm = deviceClass === "quadrature-hybrid" ? null : Math.round(between([7, 18]));
    planned.push({
      n,
      org: n % organizations.length,
      deviceClass,
      part: `SYN-${classCode[deviceClass]}${String(n).padStart(4, "0")}`,
      title: `Synthetic ${deviceClass === "frequency-multiplier" ? (factor === 2 ? "doubler" : "tripler") : deviceClass === "double-balanced-mixer" ? "mixer" : "90° hybrid"} ${round(input[0] / 1e9, 1)}–${round(input[1] / 1e9, 1)} GHz`,
      input,
      output,
      driveDbm,
      letters: n % 5 === 4 ? ["A", "B"] : ["A"],
    });
  }

  await insertRows(
    sequelize,
    "devices",
    ["organization_id", "created_by_id", "part_number", "device_class", "title", "description", "key_conditions", "created_at", "updated_at"],
    planned.map((p) => [
      orgIds[p.org],
      userIds[p.org],
      p.part,
      p.deviceClass,
      p.title,
      "Synthetic device for the catalog benchmark.",
      JSON.stringify({ inputFrequencyHz: { min: p.input[0], max: p.input[1] }, ...(p.output ? { outputFrequencyHz: { min: p.output[0], max: p.output[1] } } : {}), ...(p.driveDbm !== null ? { driveLevelDbm: p.driveDbm } : {}) }),
      now,
      now,
    ]),
  );
  const deviceIds = new Map(
    (await sequelize.query<{ id: number; part_number: string }>("SELECT id, part_number FROM devices WHERE part_number LIKE 'SYN-%'", { type: QueryTypes.SELECT })).map((d) => [d.part_number, d.id]),
  );

  const placeholderModel = JSON.stringify({ synthetic: "catalog benchmark" });
  const digest = createHash("sha256").update(placeholderModel).digest("hex");
  // Only the record: the catalog search never reads a PDF, so no object is written to the store.
  const pdf = Buffer.from("%PDF-1.4\n% synthetic placeholder for the catalog benchmark\n");
  const pdfSha = createHash("sha256").update(pdf).digest("hex");

  // Revision A of every device first, then B of every fifth: B names A as the revision it supersedes.
  let revisions = 0;
  let specRows = 0;
  for (const letter of ["A", "B"]) {
    const batch = planned.filter((p) => p.letters.includes(letter));
    const releasedAt = (p: Planned) => new Date(now.getTime() + (letter === "B" ? 20 : 0) * 86_400_000 + p.n * 60_000);
    await insertRows(
      sequelize,
      "sheet_candidates",
      ["organization_id", "device_id", "state", "model_json", "model_digest", "model_date", "acknowledgements", "note", "required_signatures", "submitted_by_id", "submitted_at", "created_at", "updated_at"],
      batch.map((p) => [orgIds[p.org], deviceIds.get(p.part), "released", placeholderModel, digest, "2026-11-01", "[]", `synthetic ${letter}`, 1, userIds[p.org], releasedAt(p), releasedAt(p), releasedAt(p)]),
    );
    const candidates = new Map(
      (await sequelize.query<{ id: number; device_id: number }>("SELECT id, device_id FROM sheet_candidates WHERE note = ?", { type: QueryTypes.SELECT, replacements: [`synthetic ${letter}`] })).map((c) => [c.device_id, c.id]),
    );
    const previous =
      letter === "B"
        ? new Map((await sequelize.query<{ id: number; device_id: number }>("SELECT id, device_id FROM sheet_revisions WHERE letter = 'A'", { type: QueryTypes.SELECT })).map((r) => [r.device_id, r.id]))
        : new Map<number, number>();
    await insertRows(
      sequelize,
      "sheet_revisions",
      ["organization_id", "device_id", "candidate_id", "sequence", "letter", "previous_revision_id", "model_json", "model_digest", "pdf_sha256", "pdf_bytes", "reference", "release_notes", "engineer_note", "released_by_id", "released_at", "created_at"],
      batch.map((p) => {
        const deviceId = deviceIds.get(p.part)!;
        return [orgIds[p.org], deviceId, candidates.get(deviceId), letter === "A" ? 1 : 2, letter, previous.get(deviceId) ?? null, placeholderModel, digest, pdfSha, pdf.length, `SYN${letter}${String(p.n).padStart(6, "0")}`, "[]", "", userIds[p.org], releasedAt(p), releasedAt(p)];
      }),
    );
    const revisionIds = new Map(
      (await sequelize.query<{ id: number; device_id: number }>("SELECT id, device_id FROM sheet_revisions WHERE letter = ?", { type: QueryTypes.SELECT, replacements: [letter] })).map((r) => [r.device_id, r.id]),
    );
    revisions += batch.length;

    await insertRows(
      sequelize,
      "released_sheets",
      ["revision_id", "organization_id", "device_id", "device_class", "part_number", "title", "letter", "input_min_hz", "input_max_hz", "output_min_hz", "output_max_hz", "drive_dbm", "released_at"],
      batch.map((p) => {
        const deviceId = deviceIds.get(p.part)!;
        return [revisionIds.get(deviceId), orgIds[p.org], deviceId, p.deviceClass, p.part, p.title, letter, p.input[0], p.input[1], p.output?.[0] ?? null, p.output?.[1] ?? null, p.driveDbm, releasedAt(p)];
      }),
    );

    const values: unknown[][] = [];
    for (const p of batch) {
      const deviceId = deviceIds.get(p.part)!;
      for (const row of findSheetTemplate(p.deviceClass)?.specifications.rows ?? []) {
        const figure = figures[row.parameter] ?? { typ: [1, 10] as [number, number], limit: "max" as const, margin: 1 };
        for (const temperatureC of [25, 85]) {
          const typ = round(between(figure.typ) + (temperatureC === 85 ? figure.margin / 3 : 0));
          const limit = round(figure.limit === "max" ? typ + figure.margin : typ - figure.margin);
          const key = `inputFrequencyHz=${p.input[0]};temperatureC=${temperatureC}`;
          values.push([revisionIds.get(deviceId), orgIds[p.org], deviceId, p.deviceClass, row.id, row.parameter, key, figure.limit === "min" ? limit : null, typ, figure.limit === "max" ? limit : null, row.unit]);
        }
      }
    }
    await insertRows(
      sequelize,
      "released_spec_values",
      ["revision_id", "organization_id", "device_id", "device_class", "row_id", "parameter", "conditions_key", "min_value", "typ_value", "max_value", "unit"],
      values,
    );
    specRows += values.length;
  }

  // One device in fifty (of those with revision A only) is withdrawn.
  const withdrawn = planned.filter((p) => p.letters.length === 1 && p.n % 50 === 7);
  const aIds = new Map((await sequelize.query<{ id: number; device_id: number }>("SELECT id, device_id FROM sheet_revisions WHERE letter = 'A'", { type: QueryTypes.SELECT })).map((r) => [r.device_id, r.id]));
  await insertRows(
    sequelize,
    "sheet_revision_withdrawals",
    ["organization_id", "revision_id", "reason", "withdrawn_by_id", "withdrawn_at", "created_at"],
    withdrawn.map((p) => [orgIds[p.org], aIds.get(deviceIds.get(p.part)!), "Synthetic withdrawal.", userIds[p.org], now, now]),
  );
  return { devices: planned.length, revisions, specRows, current: planned.length - withdrawn.length, organizations: organizations.map((o) => o.slug) };
}
