import "server-only";
import type { RevisionStanding } from "@/lib/domain/reviews";

/**
 * Cache-Control of a file served from a released revision, as for its PDF: a lettered revision's
 * bytes never change, so they are public for a year and `immutable`; "current" moves with each
 * release and a withdrawn revision's standing is news, so both are revalidated on every use.
 */
export function releasedFileCaching(addressed: string, standing: RevisionStanding): string {
  return addressed === "current" || standing === "withdrawn" ? "public, no-cache" : "public, max-age=31536000, immutable";
}

/** True when the request's If-None-Match names this ETag. */
export function matchesEtag(request: Request, etag: string): boolean {
  const wanted = request.headers.get("if-none-match");
  return !!wanted && wanted.split(",").some((tag) => tag.trim() === etag);
}
