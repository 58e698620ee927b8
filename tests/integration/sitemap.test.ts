import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { addApprovedSet, releaseSheet } from "./helpers/reviews";

// /sitemap.xml and /robots.txt as a crawler reads them, and the released page's title, description,
// canonical link and robots rule for each standing (current, superseded, withdrawn), over HTTP.

const anyone = new TestClient();
const appUrl = process.env.NEXTAUTH_URL ?? process.env.BENCHFOLD_TEST_URL ?? "http://localhost:3100";
const part = `MAP${randomBytes(3).toString("hex")}`.toUpperCase();
let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
const revisions: RevisionSummary[] = [];

type SitemapEntry = { loc: string; lastmod: string | null; priority: string | null };

async function readSitemap(): Promise<SitemapEntry[]> {
  const r = await anyone.request("/sitemap.xml");
  expect(r.status).toBe(200);
  expect(r.headers.get("content-type")).toMatch(/xml/);
  const xml = await r.text();
  expect(xml).toContain('<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">');
  return [...xml.matchAll(/<url>([\s\S]*?)<\/url>/g)].map(([, body]) => ({
    loc: body.match(/<loc>(.*?)<\/loc>/)![1],
    lastmod: body.match(/<lastmod>(.*?)<\/lastmod>/)?.[1] ?? null,
    priority: body.match(/<priority>(.*?)<\/priority>/)?.[1] ?? null,
  }));
}

/** The page's <title>, description, canonical link and robots meta, as the HTML carries them. */
async function pageHead(path: string): Promise<{ status: number; title: string; description: string; canonical: string | null; robots: string | null }> {
  const r = await anyone.request(path);
  const html = await r.text();
  const attribute = (pattern: RegExp) => html.match(pattern)?.[1] ?? null;
  return {
    status: r.status,
    title: attribute(/<title>([^<]*)<\/title>/) ?? "",
    description: attribute(/<meta name="description" content="([^"]*)"/) ?? "",
    canonical: attribute(/<link rel="canonical" href="([^"]*)"/),
    robots: attribute(/<meta name="robots" content="([^"]*)"/),
  };
}

/** A max limit on every conversion-loss group of the draft: a change worth a new revision. */
async function setConversionLossMax(engineer: TestClient, deviceId: number, maxDb: number): Promise<void> {
  const { sheet } = (await (await engineer.request(`/api/devices/${deviceId}/sheet`)).json()) as { sheet: SheetModel };
  const limits = sheet.specifications.rows
    .filter((row) => row.parameter === "conversion-loss")
    .map((row) => ({ parameter: row.parameter, conditionsKey: row.conditionsKey, max: maxDb, unit: row.unit, basis: "test" }));
  const put = await engineer.request(`/api/devices/${deviceId}/spec-limits`, { method: "PUT", json: { limits } });
  expect(put.status, await put.clone().text()).toBe(200);
}

beforeAll(async () => {
  org = await makeOrganization("vendor");
  clients = await clientsByRole(org);
  const engineer = clients.get("engineer")!;
  const reviewer = clients.get("reviewer")!;
  const device = await makeDevice(org.organization.id, part);
  await addApprovedSet(device.id, engineer, reviewer);
  revisions.push(await releaseSheet(engineer, reviewer, device.id)); // A
  await setConversionLossMax(engineer, device.id, 20);
  revisions.push(await releaseSheet(engineer, reviewer, device.id)); // B, A superseded
  await setConversionLossMax(engineer, device.id, 19);
  revisions.push(await releaseSheet(engineer, reviewer, device.id)); // C current, B superseded
  // A is withdrawn (a revision is current, superseded or withdrawn; withdrawing the newest would leave none current).
  const w = await reviewer.request(`/api/sheet-revisions/${revisions[0].id}/withdraw`, { json: { reason: "Sitemap test: wrong lot on the fixture" } });
  expect(w.status, await w.clone().text()).toBe(200);
}, 240_000);
afterAll(() => closeDb());

describe("/sitemap.xml", () => {
  it("lists the demo's released sheets by their lettered (canonical) address, absolute, never the moving 'current' address", async () => {
    const entries = await readSitemap();
    const locs = entries.map((e) => e.loc);
    for (const loc of locs) expect(loc.startsWith(`${appUrl}/`), loc).toBe(true);
    expect(locs.some((loc) => loc.endsWith("/current"))).toBe(false);
    expect(locs).toContain(`${appUrl}/catalog`);
    // The demo loader's doubler: B current, A superseded; and at least twelve demo parts in all.
    expect(locs).toContain(`${appUrl}/datasheets/kestrine/KDX-2G4/B`);
    expect(locs).toContain(`${appUrl}/datasheets/kestrine/KDX-2G4/A`);
    const demoParts = new Set(locs.filter((loc) => /\/datasheets\/(kestrine|pellacourt|wrenfield-lab)\//.test(loc)).map((loc) => loc.split("/").slice(-3, -1).join("/")));
    expect(demoParts.size).toBeGreaterThanOrEqual(12);
  });

  it("leaves a withdrawn revision out, ranks the current one above a superseded one, and dates each by its part's last change", async () => {
    const entries = await readSitemap();
    const of = (letter: string) => entries.find((e) => e.loc === `${appUrl}/datasheets/${org.organization.slug}/${part}/${letter}`);
    expect(of("A"), "withdrawn").toBeUndefined();
    expect(of("C")?.priority).toBe("0.8");
    expect(of("B")?.priority).toBe("0.3");
    // Every revision's page shows the part's whole history, so each changed with the withdrawal of A, after C's release.
    for (const letter of ["B", "C"]) {
      const lastmod = new Date(of(letter)!.lastmod!).getTime();
      expect(lastmod).toBeGreaterThan(new Date(revisions[2].releasedAt).getTime());
    }
  });
});

describe("/robots.txt", () => {
  it("opens the public pages and the released sheets' files, closes the workspace and the rest of the API, and names the sitemap", async () => {
    const r = await anyone.request("/robots.txt");
    expect(r.status).toBe(200);
    const lines = (await r.text()).split("\n").map((line) => line.trim());
    expect(lines).toContain("User-Agent: *");
    expect(lines).toContain("Allow: /");
    expect(lines).toContain("Allow: /api/v1/sheets/");
    for (const closed of ["/api/", "/devices", "/sheets", "/review", "/admin/", "/subscriptions", "/dev/"]) expect(lines).toContain(`Disallow: ${closed}`);
    expect(lines).toContain(`Sitemap: ${appUrl}/sitemap.xml`);
    // The address it names answers.
    expect((await anyone.request("/sitemap.xml")).status).toBe(200);
  });
});

describe("the released page's head", () => {
  it("the current address: the current revision's title and description, canonical to its letter", async () => {
    const head = await pageHead(`/datasheets/${org.organization.slug}/${part}/current`);
    expect(head.status).toBe(200);
    expect(head.title).toBe(`${part} Rev. C · Benchfold`);
    expect(head.description).toContain(`Revision C of the datasheet, released by ${org.organization.name} on ${revisions[2].releasedAt.slice(0, 10)}; the current revision.`);
    expect(head.canonical).toBe(`${appUrl}/datasheets/${org.organization.slug}/${part}/C`);
    expect(head.robots).toBeNull();
  });

  it("a superseded revision says so and names the current one", async () => {
    const head = await pageHead(`/datasheets/${org.organization.slug}/${part}/B`);
    expect(head.title).toBe(`${part} Rev. B (superseded) · Benchfold`);
    expect(head.description).toMatch(/; superseded by revision C\.$/);
    expect(head.canonical).toBe(`${appUrl}/datasheets/${org.organization.slug}/${part}/B`);
    expect(head.robots).toBeNull();
  });

  it("a withdrawn revision says so with the reason, and asks not to be indexed", async () => {
    const head = await pageHead(`/datasheets/${org.organization.slug}/${part}/A`);
    expect(head.status).toBe(200);
    expect(head.title).toBe(`${part} Rev. A (withdrawn) · Benchfold`);
    expect(head.description).toContain("withdrawn on");
    expect(head.description).toContain("Sitemap test: wrong lot on the fixture. Revision C is current.");
    expect(head.robots).toBe("noindex, follow");
  });

  it("pages are never stored by a shared cache (per-request nonce, the viewer's follow button); the files are", async () => {
    for (const rev of ["current", "C"]) {
      const page = await anyone.request(`/datasheets/${org.organization.slug}/${part}/${rev}`);
      expect(page.status).toBe(200);
      expect(page.headers.get("cache-control"), rev).toMatch(/private.*no-store/);
    }
    const current = await anyone.request(`/api/v1/sheets/${org.organization.slug}/${part}/current/pdf`);
    expect(current.headers.get("cache-control")).toBe("public, no-cache");
    expect(current.headers.get("etag")).toBe(`"${revisions[2].pdfSha256}"`);
    const revalidated = await anyone.request(`/api/v1/sheets/${org.organization.slug}/${part}/current/pdf`, { headers: { "if-none-match": `"${revisions[2].pdfSha256}"` } });
    expect(revalidated.status).toBe(304);
    const lettered = await anyone.request(`/api/v1/sheets/${org.organization.slug}/${part}/C/pdf`);
    expect(lettered.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
  });
});
