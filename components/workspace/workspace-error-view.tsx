import { buttonClass } from "@/components/ui/button";

/**
 * What a workspace page shows when loading it failed on the server (app/(workspace)/error.tsx).
 * The exception's own text never reaches the page: it can name tables, hosts or files. The
 * reference is the digest Next writes beside the full error in the server log.
 */
export function WorkspaceErrorView({ reference, onRetry }: { reference: string | null; onRetry?: () => void }) {
  return (
    <section aria-labelledby="workspace-error-title" className="max-w-prose" data-testid="workspace-error">
      <p className="running-head mb-2">Not shown</p>
      <h1 id="workspace-error-title" className="text-[2rem] font-semibold leading-tight">
        This page could not be loaded
      </h1>
      <p className="mt-4 text-[1.0625rem] text-ink-muted">
        Benchfold could not read what this page shows. Nothing you saved was changed. Try again in a moment; if it keeps happening, tell your
        administrator{reference ? " and quote the reference below" : ""}.
      </p>
      {reference ? (
        <p className="mt-3 text-sm text-ink-muted">
          Reference <span className="figure text-ink">{reference}</span>
        </p>
      ) : null}
      {onRetry ? (
        <p className="mt-6">
          <button type="button" onClick={onRetry} className={buttonClass.secondary}>
            Try again
          </button>
        </p>
      ) : null}
    </section>
  );
}
