import { route } from "@/lib/server/auth/guard";
import { describeInvitation } from "@/lib/server/invitations/find-open-invitation";

export const GET = route({ access: "public" }, async ({ params }) => describeInvitation(params.token));
