import { route } from "@/lib/server/auth/guard";
import { followBodySchema } from "@/lib/schemas/subscriptions";
import { follow, listSubscriptions } from "@/lib/server/subscriptions/subscriptions";

/** What the signed-in customer follows, and the notices queued to their address. */
export const GET = route({ resource: "subscriptions" }, async ({ user }) => listSubscriptions(user));

/** Follow a released part ({ organization, partNumber }) or an organization's device class ({ organization, deviceClass }): 201, or 200 when followed already. */
export const POST = route({ resource: "subscriptions", body: followBodySchema }, async ({ user, body }) => {
  const { subscription, created } = await follow(user, body);
  return Response.json({ subscription }, { status: created ? 201 : 200 });
});
