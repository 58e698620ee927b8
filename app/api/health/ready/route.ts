import { checkReadiness } from "@/lib/server/health/check-readiness";
import type { ReadinessResponse } from "@/lib/schemas/api-v1";

export const dynamic = "force-dynamic";

/**
 * Readiness for a load balancer: 200 when this instance's database, file storage (in the database
 * today) and mail relay answer within BENCHFOLD_READY_TIMEOUT_MS, 503 naming what does not, and
 * 503 from the moment the instance begins to shut down (SIGTERM, scripts/server.mjs). Public, no
 * session; never cached; the body holds no host, port or driver message. See DEVELOPERS.md,
 * "Health and shutdown".
 */
export async function GET(): Promise<Response> {
  const readiness = (await checkReadiness()) satisfies ReadinessResponse;
  const headers: Record<string, string> = { "content-type": "application/json", "cache-control": "no-store" };
  if (readiness.status !== "ready") headers["retry-after"] = "5";
  return new Response(JSON.stringify(readiness), { status: readiness.status === "ready" ? 200 : 503, headers });
}
