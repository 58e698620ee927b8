"use client";

import { WorkspaceErrorView } from "@/components/workspace/workspace-error-view";

/** A workspace page that failed on the server: said in Benchfold's words, never the exception's. */
export default function WorkspaceError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return <WorkspaceErrorView reference={error.digest ?? null} onRetry={reset} />;
}
