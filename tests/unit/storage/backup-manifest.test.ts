import { describe, expect, it } from "vitest";
import { BACKUP_FORMAT, parseManifest, referencedObjects } from "@/scripts/backup-manifest";

const hex = (c: string) => c.repeat(64);
const good = {
  format: BACKUP_FORMAT,
  createdAt: "2026-12-03T10:00:00.000Z",
  database: { name: "benchfold", file: "database.sql", sha256: hex("a"), sizeBytes: 10 },
  objects: [{ key: `sha256/bb/${hex("b")}`, sha256: hex("b"), sizeBytes: 3 }],
};

describe("parseManifest", () => {
  it("reads a manifest written by npm run backup", () => {
    expect(parseManifest(JSON.stringify(good))).toEqual(good);
  });

  it.each([
    ["not JSON", "{", /manifest.json is not JSON/],
    ["another format", JSON.stringify({ ...good, format: "x/9" }), /format is "x\/9"/],
    ["a dump path outside the folder", JSON.stringify({ ...good, database: { ...good.database, file: "../../etc/passwd" } }), /is not a plain file name/],
    ["a key that is not a content key", JSON.stringify({ ...good, objects: [{ key: "../x", sha256: hex("b"), sizeBytes: 3 }] }), /objects\[0\] is not a content key/],
    ["a negative size", JSON.stringify({ ...good, objects: [{ ...good.objects[0], sizeBytes: -1 }] }), /objects\[0\]/],
  ])("refuses %s", (_name, text, message) => {
    expect(() => parseManifest(text)).toThrow(message);
  });
});

describe("referencedObjects", () => {
  it("lists each key once, and refuses two records of one key that disagree", async () => {
    const row = { k: `sha256/bb/${hex("b")}`, h: hex("b"), n: 3 };
    expect(await referencedObjects(async () => [row, row])).toEqual([{ key: row.k, sha256: row.h, sizeBytes: 3 }]);
    await expect(referencedObjects(async () => [row, { ...row, n: 4 }])).rejects.toThrow(/disagree/);
  });
});

describe("objectReferences", () => {
  it("lists every column of the schema that holds an object key, and the sweep's and backup's SQL read each", async () => {
    const { objectReferences, referencedObjectsSql, keyReferencesSql } = await import("@/lib/server/storage/object-references");
    // The key columns the migrations made (files-to-object-store: stored_files.storage_key and the generated sheet_revisions.pdf_key).
    const { readFileSync, readdirSync } = await import("node:fs");
    const migrations = readdirSync("models/migrations").map((f) => readFileSync(`models/migrations/${f}`, "utf8")).join("\n");
    const keyColumns = [...migrations.matchAll(/ADD COLUMN (\w+_key) /g)].map((m) => m[1]).sort();
    expect(keyColumns).toEqual(objectReferences.map((r) => r.key).sort());
    for (const r of objectReferences) {
      expect(referencedObjectsSql).toContain(`SELECT ${r.key} AS k, ${r.sha256} AS h, ${r.sizeBytes} AS n FROM ${r.table}`);
      expect(keyReferencesSql).toContain(`FROM ${r.table} WHERE ${r.lookup}`);
    }
  });
});
