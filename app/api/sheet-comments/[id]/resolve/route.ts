import { route } from "@/lib/server/auth/guard";
import { resolveComment } from "@/lib/server/reviews/comments";
import { readIdParam } from "@/lib/server/route-params";

/** Resolves a comment thread; only the person who opened it may. */
export const POST = route({ resource: "sheet-comments" }, async ({ user, params }) => ({
  comments: await resolveComment({ actor: user, commentId: readIdParam(params.id, "comment") }),
}));
