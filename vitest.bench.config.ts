import { defineConfig } from "vitest/config";
import path from "node:path";

// `npm run bench` only: benchmarks that need the same module resolution as the app.
export default defineConfig({
  resolve: { alias: { "@": path.resolve(__dirname) } },
  test: { include: ["scripts/bench/**/*.bench-run.ts"], environment: "node", fileParallelism: false },
});
