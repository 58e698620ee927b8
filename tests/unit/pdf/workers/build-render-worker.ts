import { mkdirSync, mkdtempSync } from "node:fs";
import path from "node:path";
import { build } from "esbuild";

/**
 * The PDF render worker as plain Node can run it, for unit tests and `npm run bench` (the app runs
 * the file `next build` makes from the same source): one ES module with the TypeScript compiled,
 * packages loaded from node_modules as Node resolves them, and `server-only` empty, as it is in
 * Next's server bundles.
 */
export async function buildRenderWorkerForNode(entry = "lib/server/pdf/pdf-render-worker.ts"): Promise<string> {
  const root = path.resolve(__dirname, "../../../..");
  // Inside node_modules, so that Node finds the packages the bundle leaves out.
  const cache = path.join(root, "node_modules", ".cache", "benchfold");
  mkdirSync(cache, { recursive: true });
  const outfile = path.join(mkdtempSync(path.join(cache, "pdf-worker-")), "pdf-render-worker.mjs");
  await build({
    absWorkingDir: root,
    entryPoints: [path.join(root, entry)],
    outfile,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: "external",
    jsx: "automatic",
    logLevel: "error",
    plugins: [
      {
        name: "server-only-is-empty",
        setup(b) {
          b.onResolve({ filter: /^server-only$/ }, () => ({ path: "server-only", namespace: "empty" }));
          b.onLoad({ filter: /.*/, namespace: "empty" }, () => ({ contents: "", loader: "js" }));
        },
      },
    ],
  });
  return outfile;
}
