import { route } from "@/lib/server/auth/guard";
import { describeInvitation } from "@/lib/server/invitations/find-open-invitation";

export const GET = route({ resource: "account" }, async ({ params }) => describeInvitation(params.token));
