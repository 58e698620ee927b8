import { route } from "@/lib/server/auth/guard";
import { revokeBenchToken } from "@/lib/server/bench-tokens/revoke-bench-token";
import { readIdParam } from "@/lib/server/route-params";

export const DELETE = route({ resource: "bench-tokens" }, async ({ user, params }) => ({
  benchToken: await revokeBenchToken({ actor: user, tokenId: readIdParam(params.id, "bench token") }),
}));
