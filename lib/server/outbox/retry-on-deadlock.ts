import "server-only";

// ER_LOCK_DEADLOCK 1213 and ER_LOCK_WAIT_TIMEOUT 1205 (MariaDB error reference): InnoDB rolled the
// statement back and nothing of it is left, so running it again is safe.
const RETRYABLE = new Set([1213, 1205]);

function isRetryable(error: unknown): boolean {
  const e = error as { parent?: { errno?: unknown }; original?: { errno?: unknown }; errno?: unknown } | null;
  const errno = e?.parent?.errno ?? e?.original?.errno ?? e?.errno;
  return typeof errno === "number" && RETRYABLE.has(errno);
}

/** Runs one outbox statement (or short transaction), again when InnoDB chose it as a deadlock victim. */
export async function retryOnDeadlock<T>(run: () => Promise<T>, tries = 5): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await run();
    } catch (error) {
      if (attempt >= tries || !isRetryable(error)) throw error;
    }
  }
}
