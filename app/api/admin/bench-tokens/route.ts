import { benchTokenBodySchema } from "@/lib/schemas/measurements";
import { route } from "@/lib/server/auth/guard";
import { createBenchToken } from "@/lib/server/bench-tokens/create-bench-token";
import { listBenchTokens } from "@/lib/server/bench-tokens/list-bench-tokens";

export const GET = route({ resource: "bench-tokens" }, async ({ user }) => ({ benchTokens: await listBenchTokens(user.organizationId) }));

export const POST = route({ resource: "bench-tokens", body: benchTokenBodySchema }, async ({ user, body }) =>
  Response.json(await createBenchToken({ actor: user, name: body.name }), { status: 201 }),
);
