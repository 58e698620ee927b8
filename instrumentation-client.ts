import { config } from "zod/v4/core";

// Runs in the browser before the app's own modules (Next's instrumentation-client convention).
// Zod 4 compiles object parsers with new Function and first probes whether eval works; under
// the Content-Security-Policy (proxy.ts, no 'unsafe-eval') the probe is refused and reported as
// a violation on every page with a form. jitless skips the probe and the compiled path (zod
// README, "z.config({ jitless: true })"); parsing is the same. `config` from zod/v4/core keeps
// the schema library itself out of this shared chunk.
config({ jitless: true });
