import { commentBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { addComment } from "@/lib/server/reviews/comments";
import { readIdParam } from "@/lib/server/route-params";

/** A comment on a candidate, anchored to the sheet, a row, a chart or a prose section, or a reply (201). */
export const POST = route({ resource: "sheet-comments", body: commentBodySchema }, async ({ user, params, body }) =>
  Response.json({ comments: await addComment({ author: user, candidateId: readIdParam(params.id, "sheet candidate"), body }) }, { status: 201 }),
);
