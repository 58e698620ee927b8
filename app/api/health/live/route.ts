export const dynamic = "force-dynamic";

const live = JSON.stringify({ status: "ok" });

/**
 * Liveness for a load balancer: the process answers HTTP. Constant JSON, no session, no database
 * (a database outage must not take every instance out of rotation; the API answers 503 then).
 * `npm run bench` uses it as the cheapest route handler, the reference for the catalog search.
 */
export function GET(): Response {
  return new Response(live, { headers: { "content-type": "application/json", "cache-control": "no-store" } });
}
