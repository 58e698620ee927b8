/**
 * What an app process does when it is asked to stop (SIGTERM), shared between scripts/server.mjs
 * (plain JavaScript, outside the bundles) and the app's code (every bundled copy of it) through
 * two process-wide symbols. No "server-only" guard: models/ registers here, and scripts and tests
 * import models/ outside the app's bundles.
 *
 * - `Symbol.for("benchfold.shutting-down")`: set to true by the server the moment a stop begins;
 *   the readiness probe answers 503 from then on (`isShuttingDown`).
 * - `Symbol.for("benchfold.shutdown-hooks")`: a Set of `{ name, run }` the server runs once the
 *   requests in flight are finished (or the grace period is over): each bundled copy of models/
 *   closes its connection pool, the PDF render pool stops its workers (`onShutdown`).
 */

export type ShutdownHook = { name: string; run: () => Promise<void> };

const SHUTTING_DOWN = Symbol.for("benchfold.shutting-down");
const HOOKS = Symbol.for("benchfold.shutdown-hooks");

type Holder = { [SHUTTING_DOWN]?: boolean; [HOOKS]?: Set<ShutdownHook> };

export function isShuttingDown(): boolean {
  return (globalThis as Holder)[SHUTTING_DOWN] === true;
}

/** Registers cleanup for the server to run when the process stops; the returned function takes it back. */
export function onShutdown(name: string, run: () => Promise<void>): () => void {
  const holder = globalThis as Holder;
  const hooks = (holder[HOOKS] ??= new Set<ShutdownHook>());
  const hook = { name, run };
  hooks.add(hook);
  return () => void hooks.delete(hook);
}
