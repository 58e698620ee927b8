import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/**
 * What a client component may import is decided by the file it imports from, so the check is
 * static: every module specifier in components/ (import, import type, export … from, import())
 * is resolved against the tree and must not land in lib/server/ or models/. Pure code in
 * lib/domain/ must not reach them either, nor React, Next or Sequelize.
 */
const root = path.resolve(__dirname, "../../..");

function sourceFiles(dir: string): string[] {
  return readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((entry) => {
    const rel = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(rel);
    return /\.(ts|tsx|mts)$/.test(entry.name) ? [rel] : [];
  });
}

/** Every module specifier of a source text: static imports and re-exports (type-only ones too) and dynamic import(). */
function moduleSpecifiers(source: string): string[] {
  const found: string[] = [];
  const patterns = [/\b(?:import|export)\s[^"';]*?\sfrom\s*["']([^"']+)["']/g, /\bimport\s*["']([^"']+)["']/g, /\bimport\s*\(\s*["']([^"']+)["']\s*\)/g];
  for (const pattern of patterns) for (const match of source.matchAll(pattern)) found.push(match[1]);
  return found;
}

/** The specifier as a path from the repository root ("@/x" and "./x" alike); a package name as written. */
function resolveSpecifier(specifier: string, fromFile: string): string {
  if (specifier.startsWith("@/")) return path.normalize(specifier.slice(2));
  if (specifier.startsWith(".")) return path.normalize(path.join(path.dirname(fromFile), specifier));
  return specifier;
}

function forbiddenImports(source: string, fromFile: string, forbidden: RegExp): string[] {
  return moduleSpecifiers(source).filter((s) => forbidden.test(resolveSpecifier(s, fromFile).split(path.sep).join("/")));
}

const serverOnly = /^(lib\/server|models)(\/|$)/;
const notPure = /^(lib\/server|models|react|react-dom|next|sequelize|server-only)(\/|$)/;

describe("client-importable code stays away from the server", () => {
  it("finds a forbidden import in every form it can be written", () => {
    const sample = [
      'import type { DeviceSummary } from "@/lib/server/devices/device-summary";',
      'import { Device } from "../../models";',
      'export { x } from "@/models/device";',
      'import {\n  a,\n  b,\n} from "@/lib/server/auth/guard";',
      'const m = await import("@/lib/server/pdf/render-chart");',
      'import "@/lib/server/mail/send-mail";',
      'import { z } from "zod";',
      'import type { DeviceSummary } from "@/lib/domain/devices";',
      'import { serverless } from "@/lib/serverless";',
    ].join("\n");
    expect(forbiddenImports(sample, "components/devices/x.tsx", serverOnly)).toEqual([
      "@/lib/server/devices/device-summary",
      "../../models",
      "@/models/device",
      "@/lib/server/auth/guard",
      "@/lib/server/mail/send-mail",
      "@/lib/server/pdf/render-chart",
    ]);
  });

  const components = sourceFiles("components");
  it("reads the components tree", () => {
    expect(components.length).toBeGreaterThan(50);
  });

  it.each(components)("%s imports nothing from lib/server or models", (file) => {
    expect(forbiddenImports(readFileSync(path.join(root, file), "utf8"), file, serverOnly)).toEqual([]);
  });

  it.each(["lib/domain", "lib/format", "lib/charts", "lib/design", "lib/access"].flatMap(sourceFiles))("%s is pure: no React, Next, Sequelize, lib/server or models", (file) => {
    expect(forbiddenImports(readFileSync(path.join(root, file), "utf8"), file, notPure)).toEqual([]);
  });
});

describe("frozen migrations", () => {
  // A migration describes the schema of its day: it copies the values of a list instead of importing the live one.
  // Pinned packages are not live project code: Node's built-ins, and the S3 client of the migration that moved
  // the files out of MariaDB (20261203-1500), which copies the key scheme and settings of its day.
  const allowed = new Set(["sequelize", "@aws-sdk/client-s3"]);
  it.each(sourceFiles("models/migrations"))("%s imports nothing but Sequelize, Node built-ins and the S3 client", (file) => {
    expect(moduleSpecifiers(readFileSync(path.join(root, file), "utf8")).filter((s) => !allowed.has(s) && !s.startsWith("node:"))).toEqual([]);
  });
});

describe("models are reached through db() only", () => {
  // models/index.ts exports the model classes as types alone (a value import of one fails the type
  // check); this covers the other way round it: a value import straight from a model's own file.
  const valueImports = (source: string) =>
    [...source.matchAll(/\bimport\s+(?!type\b)([^"';]*?)\s+from\s*["']([^"']+)["']/g)].map((m) => ({ what: m[1], from: m[2] }));

  it("finds a value import from a model file, and lets a type import pass", () => {
    const sample = 'import { Device } from "@/models/device";\nimport type { User } from "@/models/user";\nimport { db } from "@/models";';
    expect(valueImports(sample).filter((i) => /models\/[a-z-]+$/.test(i.from)).map((i) => i.from)).toEqual(["@/models/device"]);
  });

  it("no file outside models/ imports a model class as a value", () => {
    const offenders = ["lib", "app", "components", "scripts", "tests", "templates"].flatMap((dir) =>
      sourceFiles(dir)
        .filter((file) => file !== path.join("tests", "unit", "architecture", "import-boundaries.test.ts"))
        .flatMap((file) =>
        valueImports(readFileSync(path.join(root, file), "utf8"))
          .map((i) => ({ ...i, target: resolveSpecifier(i.from, file).split(path.sep).join("/") }))
          .filter((i) => /^models\/(?!index$|connection$|migrator$|seeders\/)[a-z-]+$/.test(i.target) && !/^\{\s*type\b/.test(i.what))
          .map((i) => `${file}: ${i.what} from ${i.from}`),
      ),
    );
    expect(offenders).toEqual([]);
  });
});
