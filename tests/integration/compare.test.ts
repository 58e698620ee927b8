import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { releaseTwoRevisions } from "./helpers/reviews";

// GET /api/v1/compare/csv and the /compare page over HTTP: a part's two revisions released here,
// and the demo's released hybrids (scripts/seed-demo-releases.ts runs before the integration tests).

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
let revA: RevisionSummary;
let revB: RevisionSummary;
let partNumber: string;
const anon = new TestClient();
const as = (who: Who) => clients.get(who)!;

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
  ({ partNumber, revA, revB } = await releaseTwoRevisions(org.organization.id, as("engineer"), as("reviewer")));
}, 180_000);
afterAll(() => closeDb());

const own = (letter: string) => `${org.organization.slug}/${partNumber}/${letter}`;

/** RFC 4180 lines of the CSV (no field here holds a line break), each split into its fields. */
function parseCsv(text: string): string[][] {
  return text
    .replace(/^\uFEFF/, "")
    .split("\r\n")
    .filter(Boolean)
    .map((line) => {
      const fields: string[] = [];
      const pattern = /("(?:[^"]|"")*"|[^,]*)(,|$)/g;
      for (const m of line.matchAll(pattern)) {
        fields.push(m[1].startsWith('"') ? m[1].slice(1, -1).replace(/""/g, '"') : m[1]);
        if (m[2] === "") break;
      }
      return fields;
    });
}

describe("GET /api/v1/compare/csv", () => {
  it("sends the table of two revisions as a CSV download, signed out", async () => {
    const r = await anon.request(`/api/v1/compare/csv?sheets=${own("A")},${own("B")}`);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toMatch(/^text\/csv; charset=utf-8/);
    expect(r.headers.get("content-disposition")).toBe(`attachment; filename="${partNumber}-A_${partNumber}-B-compare.csv"`);
    expect(r.headers.get("cache-control")).toBe("public, no-cache");
    const rows = parseCsv(await r.text());
    const [header, ...lines] = rows;
    expect(header.slice(0, 6)).toEqual(["Parameter", "Symbol", "Figure", "Unit", "Better", "Conditions"]);
    expect(header[6]).toBe(`${partNumber} Rev. A`);
    expect(header[9]).toBe(`${partNumber} Rev. B`);
    expect(header).toHaveLength(13);
    // The conversion loss of the doubler at +10 dBm per port, as each released model states it.
    const sheetA = (await (await anon.request(`/api/v1/sheets/${own("A")}`)).json()) as { sheet: { specifications: { rows: { rowId: string; typ: { text: string } }[] } } };
    const typA = sheetA.sheet.specifications.rows.find((row) => row.rowId === "conversion-loss-at-drive")!.typ.text;
    const cl = lines.find((l) => l[0] === "Conversion loss" && l[2] === "typ")!;
    expect(cl[3]).toBe("dB");
    expect(cl[4]).toBe("lower is better");
    expect(cl[6]).toBe(typA.replace("\u2212", "-"));
    expect(cl[9]).not.toBe("");
    expect(lines.every((l) => l.length === header.length)).toBe(true);
  });

  it("aligns the demo's released hybrid and splitter, with the band mismatch said and the better value named", async () => {
    const r = await anon.request("/api/v1/compare/csv?sheets=kestrine/KQH-2G/A,pellacourt/PS-2W/current");
    expect(r.status).toBe(200);
    const [header, ...lines] = parseCsv(await r.text());
    expect(header[6]).toBe("KQH-2G Rev. A");
    expect(header[9]).toBe("PS-2W Rev. A");
    const il = lines.find((l) => l[0] === "Insertion loss, port 1 to 2 (S21)" && l[2] === "typ")!;
    expect(il[5]).toBe("differ: band");
    expect(il[7]).toContain("Band 1.7–2.3");
    expect(il[10]).toContain("Band 0.5–2.5");
    expect(Number(il[6])).toBeLessThan(Number(il[9]));
    expect(il[12]).toBe("KQH-2G Rev. A");
  });

  it.each([
    ["one sheet", () => `sheets=${own("A")}`, 422, "only one was given"],
    ["nine sheets", () => `sheets=${Array.from({ length: 9 }, (_, i) => `${org.organization.slug}/P-${i}/A`).join(",")}`, 422, "At most 4 sheets"],
    ["nothing", () => "", 422, "none was given"],
    ["a malformed entry", () => `sheets=${own("A")},just-a-part`, 422, '"just-a-part" is not a sheet\'s address'],
    ["a lower-case revision", () => `sheets=${own("A")},${own("b")}`, 422, '"b" is not a revision'],
    ["ten thousand characters", () => `sheets=${"x".repeat(10_000)}`, 422, "at most 1000 are read"],
    ["an unknown sheet", () => `sheets=${own("A")},${org.organization.slug}/NO-SUCH-PART/A,nobody/X/current`, 404, () => `No released sheet at ${org.organization.slug}/NO-SUCH-PART/A, nobody/X/current`],
    ["a revision not released", () => `sheets=${own("A")},${own("C")}`, 404, () => `No released sheet at ${own("C")}`],
    ["one revision by two addresses", () => `sheets=${own("B")},${own("current")}`, 422, "are the same revision (B)"],
  ])("refuses %s with %i and a message naming it", async (_what, query, status, words) => {
    const r = await anon.request(`/api/v1/compare/csv?${query()}`);
    expect(r.status).toBe(status);
    const body = (await r.json()) as { error: { code: string; message: string } };
    // Words that name this file's organization are made once it exists (it.each reads its table before beforeAll).
    expect(body.error.message).toContain(typeof words === "function" ? words() : words);
  });
});

describe("the /compare page", () => {
  it("draws the table, the mark of the better value and the overlaid curves for a signed-out visitor", async () => {
    const r = await anon.request(`/compare?sheets=${own("A")},${own("B")}`, { headers: { accept: "text/html" } });
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain("Specifications side by side");
    expect(html).toContain(`${partNumber} Rev. A`);
    expect(html).toContain(`/api/v1/compare/csv?sheets=${own("A")},${own("B")}`);
    // Server-drawn SVG overlays: no chart code is sent to the browser.
    expect(html).toMatch(/data-testid="compare-panel"[^]*?<svg/);
  });

  it.each([
    ["one sheet", () => `sheets=${own("A")}`, "only one was given"],
    ["an unknown sheet", () => `sheets=${own("A")},nobody/X/A`, "No released sheet at nobody/X/A"],
    ["an empty selection", () => "sheets=,,,", "none was given"],
    ["a malformed selection", () => "sheets=a,b", "is not a sheet"],
  ])("says plainly what is wrong with %s", async (_what, query, words) => {
    const r = await anon.request(`/compare?${query()}`, { headers: { accept: "text/html" } });
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain('data-testid="compare-issues"');
    expect(html).toContain(words.replace(/'/g, "&#x27;"));
  });
});
