import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { allows, apiResources, isPublic, pageResources, resources, rolesAllowed, type Resource } from "@/lib/access/matrix";
import { navigationFor, roles, workspaceNav } from "@/lib/domain/permissions";

// The access matrix against the file tree: every page and every exported method of every route
// handler has a row, no row names something that is not there, and each file asks for the
// resource its row names. Who then gets 200, 401 or 403 is checked over HTTP by
// tests/integration/access.test.ts and pages.test.ts, from the same rows.

const appDir = path.resolve(__dirname, "../../../app");
const httpMethods = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;

function filesNamed(dir: string, name: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return filesNamed(full, name);
    return entry.name === name ? [full] : [];
  });
}

/** app/(workspace)/sheets/[deviceId]/page.tsx → /sheets/[deviceId]: route groups leave no trace in the URL. */
function routeOf(file: string): string {
  const segments = path.relative(appDir, path.dirname(file)).split(path.sep).filter((s) => s && !/^\(.*\)$/.test(s));
  return `/${segments.join("/")}`;
}

/** The HTTP methods a route file exports, as `export const GET = …`, `export async function POST`, or `export { handler as GET }`. */
function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:const|let|async\s+function|function)\s+([A-Z]+)\b/g)) found.add(m[1]);
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of m[1].split(",")) found.add(part.trim().split(/\s+as\s+/).pop()!.trim());
  }
  return [...found].filter((name) => (httpMethods as readonly string[]).includes(name)).sort();
}

const pages = filesNamed(appDir, "page.tsx").map((file) => ({ file, route: routeOf(file), source: readFileSync(file, "utf8") }));
const routeFiles = filesNamed(path.join(appDir, "api"), "route.ts").map((file) => ({ file, route: routeOf(file), source: readFileSync(file, "utf8") }));
const methods = routeFiles.flatMap(({ file, route, source }) => exportedMethods(source).map((method) => ({ file, key: `${method} ${route}`, method, source })));

describe("the route tree walker", () => {
  it("finds the pages and methods it should (a walker that finds nothing would pass everything)", () => {
    expect(pages.map((p) => p.route)).toEqual(expect.arrayContaining(["/", "/devices/[id]", "/sheets/[deviceId]", "/dev/mailbox"]));
    expect(methods.map((m) => m.key)).toEqual(expect.arrayContaining(["GET /api/auth/[...nextauth]", "POST /api/auth/[...nextauth]", "POST /api/v1/measurements", "DELETE /api/admin/bench-tokens/[id]"]));
    expect(exportedMethods("export const GET = route(x);\nexport async function POST() {}\nexport { handler as PUT, other as DELETE };\nexport const dynamic = 1;")).toEqual(["DELETE", "GET", "POST", "PUT"]);
  });
});

describe("every page has a row in the access matrix and asks for its resource", () => {
  it.each(pages.map((p) => [p.route, p] as const))("%s", (route, page) => {
    expect(Object.keys(pageResources), `${path.relative(appDir, page.file)} has no row in pageResources (lib/access/matrix.ts)`).toContain(route);
    const resource: Resource = pageResources[route as keyof typeof pageResources];
    const asked = [...page.source.matchAll(/requirePageUser\(\{\s*resource:\s*"([^"]+)"/g)].map((m) => m[1]);
    if (isPublic(resource)) expect(asked, "a public page asks for no session").toEqual([]);
    else expect(asked, `${route} must call requirePageUser({ resource: "${resource}", … })`).toEqual([resource]);
  });

  it("has no row for a page that does not exist", () => {
    expect(Object.keys(pageResources).sort()).toEqual(pages.map((p) => p.route).sort());
  });
});

describe("every API method has a row in the access matrix and asks for its resource", () => {
  it.each(methods.map((m) => [m.key, m] as const))("%s", (key, { method, source }) => {
    expect(Object.keys(apiResources), `${key} has no row in apiResources (lib/access/matrix.ts)`).toContain(key);
    const resource: Resource = apiResources[key as keyof typeof apiResources];
    const declared = source.match(new RegExp(`export const ${method} = route\\(\\{\\s*resource:\\s*"([^"]+)"`))?.[1];
    if (declared === undefined) {
      // Only next-auth's own handler and the bench-token upload answer without route().
      expect(["public", "bench-token"], `${key} is not wrapped in route({ resource })`).toContain(resources[resource].access);
    } else {
      expect(declared, `${key} declares another resource than its row`).toBe(resource);
    }
  });

  it("has no row for a method that does not exist", () => {
    expect(Object.keys(apiResources).sort()).toEqual(methods.map((m) => m.key).sort());
  });
});

describe("decisions the matrix records", () => {
  it("a page and the API routes that serve the same resource admit the same roles", () => {
    expect(apiResources["GET /api/devices/[id]/sheet"]).toBe(pageResources["/sheets/[deviceId]"]);
    expect(apiResources["GET /api/devices/[id]/sheet/pdf"]).toBe(pageResources["/sheets/[deviceId]"]);
    expect(apiResources["GET /api/measurements/pending"]).toBe(pageResources["/review"]);
    expect(apiResources["GET /api/admin/instruments"]).toBe(pageResources["/admin/instruments"]);
  });

  it.each([
    ["sheet-drafts", ["engineer", "reviewer"]],
    ["sheet-edit", ["engineer"]],
    ["measurement-review", ["reviewer"]],
    ["measurement-upload", ["engineer"]],
    ["devices", ["admin", "engineer", "reviewer"]],
    ["people", ["admin"]],
    ["subscriptions", ["customer"]],
    ["session", ["admin", "engineer", "reviewer", "customer"]],
    ["bench-upload", []],
  ] as const)("%s admits %j", (resource, expected) => {
    expect(rolesAllowed(resource)).toEqual(expected);
  });

  it("shows a navigation link exactly to the roles its page admits", () => {
    for (const item of workspaceNav) {
      const resource = pageResources[item.href as keyof typeof pageResources];
      expect(resource, `${item.href} is a page of the matrix`).toBeDefined();
      for (const role of roles) {
        expect(navigationFor(role).some((i) => i.href === item.href), `${item.href} for ${role}`).toBe(allows(role, resource));
      }
    }
  });
});
