import { route } from "@/lib/server/auth/guard";
import { readIdParam } from "@/lib/server/route-params";
import { unfollow } from "@/lib/server/subscriptions/subscriptions";

export const DELETE = route({ resource: "subscriptions" }, async ({ user, params }) => {
  await unfollow(user, readIdParam(params.id, "subscription"));
  return { ok: true };
});
