/**
 * Files in the object store (DEVELOPERS.md, "Files and backups"), over HTTP against the run's app and
 * its fake S3 store (scripts/fake-s3.ts):
 * - an upload's bytes are an object under their content key; the database row holds key, size, SHA-256;
 * - a store that refuses writes: the upload answers 503 saying nothing was saved, and nothing was
 *   (no set, no file row, no audit event); the release answers 503 and leaves no revision, the
 *   candidate still approved, and releases once the store is back;
 * - a store that refuses reads: the file download is a 503;
 * - an object whose bytes are not the recorded ones is never served (a clear error naming the
 *   hash mismatch); put right, it is served again.
 */
import { createHash, randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { contentKey } from "@/lib/server/storage/object-key";
import { closeDb, db } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { runStore, setFakeS3Faults } from "./helpers/object-store";
import { deviceWithApprovedData, release, sign, submitDraft } from "./helpers/reviews";
import { fixtureUpload, fixturesDir } from "./helpers/uploads";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
const as = (who: Who) => clients.get(who)!;

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
});
afterEach(() => setFakeS3Faults({}));
afterAll(() => closeDb());

/** A fixture with a unique comment line, so each upload is new bytes (a new key) on a new device. */
function uniqueUpload(): { form: FormData; bytes: Buffer } {
  const original = readFileSync(path.join(fixturesDir, "examples/drive-sweep-doubler.csv"), "utf8");
  const bytes = Buffer.from(`# note: storage test ${randomBytes(6).toString("hex")}\n${original}`);
  return { form: fixtureUpload("examples/drive-sweep-doubler.csv", {}, new Uint8Array(bytes)), bytes };
}

async function counts(organizationId: number) {
  const [row] = await db().sequelize.query<{ sets: number; files: number; audits: number; revisions: number }>(
    `SELECT (SELECT COUNT(*) FROM measurement_sets WHERE organization_id = :o) AS sets,
            (SELECT COUNT(*) FROM stored_files WHERE organization_id = :o) AS files,
            (SELECT COUNT(*) FROM audit_events WHERE organization_id = :o) AS audits,
            (SELECT COUNT(*) FROM sheet_revisions WHERE organization_id = :o) AS revisions`,
    { type: QueryTypes.SELECT, replacements: { o: organizationId } },
  );
  return { sets: Number(row.sets), files: Number(row.files), audits: Number(row.audits), revisions: Number(row.revisions) };
}

describe("an upload", () => {
  it("puts the bytes in the store under their content key; the row keeps key, size and SHA-256", async () => {
    const deviceId = (await makeDevice(org.organization.id)).id;
    const { form, bytes } = uniqueUpload();
    const r = await as("engineer").request(`/api/devices/${deviceId}/measurements`, { multipart: form });
    expect(r.status, await r.clone().text()).toBe(201);
    const sha = createHash("sha256").update(bytes).digest("hex");
    const [row] = await db().sequelize.query<{ storage_key: string; size_bytes: number; sha256: string }>(
      "SELECT f.storage_key, f.size_bytes, f.sha256 FROM stored_files f JOIN measurement_sets s ON s.stored_file_id = f.id WHERE s.device_id = ?",
      { type: QueryTypes.SELECT, replacements: [deviceId] },
    );
    expect(row).toEqual({ storage_key: contentKey(sha), size_bytes: bytes.length, sha256: sha });
    expect((await runStore().get(row.storage_key)).equals(bytes)).toBe(true);
  });

  it("stores nothing and answers 503 saying so when the store refuses the write", async () => {
    const deviceId = (await makeDevice(org.organization.id)).id;
    const before = await counts(org.organization.id);
    const { form, bytes } = uniqueUpload();
    await setFakeS3Faults({ writes: "fail" });
    const r = await as("engineer").request(`/api/devices/${deviceId}/measurements`, { multipart: form });
    expect(r.status).toBe(503);
    const { error } = (await r.json()) as { error: { code: string; message: string } };
    expect(error.code).toBe("unavailable");
    expect(error.message).toMatch(/file store did not accept the file, so nothing was saved/);
    expect(await counts(org.organization.id)).toEqual(before);
    await setFakeS3Faults({});
    await expect(runStore().get(contentKey(createHash("sha256").update(bytes).digest("hex")))).rejects.toThrow(/no object/);
    // The same upload goes through once the store takes writes again.
    const again = await as("engineer").request(`/api/devices/${deviceId}/measurements`, { multipart: uniqueUpload().form });
    expect(again.status, await again.clone().text()).toBe(201);
  });
});

describe("reading a stored file", () => {
  let setId = 0;
  let bytes: Buffer;
  let key = "";
  beforeAll(async () => {
    const deviceId = (await makeDevice(org.organization.id)).id;
    const upload = uniqueUpload();
    bytes = upload.bytes;
    const r = await as("engineer").request(`/api/devices/${deviceId}/measurements`, { multipart: upload.form });
    expect(r.status).toBe(201);
    setId = ((await r.json()) as { measurementSet: { id: number } }).measurementSet.id;
    key = contentKey(createHash("sha256").update(bytes).digest("hex"));
  });

  it("is a 503 while the store refuses reads", async () => {
    await setFakeS3Faults({ reads: "fail" });
    const r = await as("engineer").request(`/api/measurements/${setId}/file`);
    expect(r.status).toBe(503);
    expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/file store cannot be reached/);
  });

  it("refuses to serve bytes that are not the recorded ones, and serves them again once put right", async () => {
    const store = runStore();
    const tampered = Buffer.from(bytes);
    tampered[tampered.length - 2] ^= 0x01;
    await store.put({ key, bytes: tampered, sha256: createHash("sha256").update(tampered).digest("hex"), contentType: "text/csv" });
    try {
      const r = await as("engineer").request(`/api/measurements/${setId}/file`);
      expect(r.status).toBe(500);
      const { error } = (await r.json()) as { error: { message: string; details: { storage: string } } };
      expect(error.message).toMatch(/does not match its recorded SHA-256, so it is not served/);
      expect(error.details.storage).toBe("hash-mismatch");
    } finally {
      await store.put({ key, bytes, sha256: createHash("sha256").update(bytes).digest("hex"), contentType: "text/csv" });
    }
    const ok = await as("engineer").request(`/api/measurements/${setId}/file`);
    expect(ok.status).toBe(200);
    expect(Buffer.from(await ok.arrayBuffer()).equals(bytes)).toBe(true);
  });
});

describe("a release", () => {
  it("leaves no revision and answers 503 when the store refuses the PDF; releases once it takes it", { timeout: 180_000 }, async () => {
    const deviceId = await deviceWithApprovedData(org.organization.id, as("engineer"), as("reviewer"));
    const candidate = await submitDraft(as("engineer"), deviceId);
    expect((await sign(as("reviewer"), candidate.id)).status).toBe(200);
    const before = await counts(org.organization.id);

    await setFakeS3Faults({ writes: "fail" });
    const refused = await release(as("engineer"), candidate.id, "Store down.");
    expect(refused.status).toBe(503);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/nothing was saved/);
    expect(await counts(org.organization.id)).toEqual(before);
    const [state] = await db().sequelize.query<{ state: string }>("SELECT state FROM sheet_candidates WHERE id = ?", { type: QueryTypes.SELECT, replacements: [candidate.id] });
    expect(state.state).toBe("approved");

    await setFakeS3Faults({});
    const released = await release(as("engineer"), candidate.id, "Store back.");
    expect(released.status, await released.clone().text()).toBe(201);
    const { revision } = (await released.json()) as { revision: RevisionSummary };
    const [row] = await db().sequelize.query<{ pdf_key: string }>("SELECT pdf_key FROM sheet_revisions WHERE id = ?", { type: QueryTypes.SELECT, replacements: [revision.id] });
    expect(row.pdf_key).toBe(contentKey(revision.pdfSha256));
    const pdf = Buffer.from(await (await new TestClient().request(revision.pdfPath)).arrayBuffer());
    expect(createHash("sha256").update(pdf).digest("hex")).toBe(revision.pdfSha256);
    expect((await runStore().get(row.pdf_key)).equals(pdf)).toBe(true);
  });
});
