import { createHash } from "node:crypto";
import { route } from "@/lib/server/auth/guard";
import { findReleasedRevision } from "@/lib/server/reviews/list-revisions";
import type { ReleasedSheetResponse } from "@/lib/schemas/api-v1";

export const dynamic = "force-dynamic";

/**
 * A released revision's frozen sheet model as versioned JSON, with its standing and the part's
 * revision history: `{ apiVersion: 1, revision, history, sheet }`. The model never changes, but the
 * standing and the history do (a later release supersedes, a withdrawal withdraws), so unlike the
 * PDF's bytes the answer is not immutable: it is public and revalidated on every use, and its ETag
 * (a digest of the revisions and their standings; the frozen model is named by its revision id)
 * answers 304 while nothing changed.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const released = await findReleasedRevision({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const { summary, history } = released;
  const state = JSON.stringify([summary.id, history.map((r) => [r.id, r.standing])]);
  const etag = `"${createHash("sha256").update(state).digest("hex").slice(0, 40)}"`;
  const headers: Record<string, string> = {
    "cache-control": "public, no-cache",
    etag,
    "x-benchfold-revision": summary.letter,
    "x-benchfold-standing": summary.standing,
  };
  const wanted = request.headers.get("if-none-match");
  if (wanted && wanted.split(",").some((tag) => tag.trim() === etag)) return new Response(null, { status: 304, headers });
  return Response.json({ apiVersion: 1, revision: summary, history, sheet: released.model } satisfies ReleasedSheetResponse, { headers });
});
