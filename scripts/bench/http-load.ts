/**
 * The load benchmark's client loop, shared by every target: `clients` concurrent clients, each
 * sending the next GET as soon as its last answer is read in full, for a fixed time. Requests per
 * second, p50/p95 latency and the failures by status or error message. `url` may be a function of
 * the request's number, for a target that is a set of addresses taken in turn.
 */
export type LoadResult = { requests: number; perSecond: number; p50: number; p95: number; failures: Map<string, number> };

export const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];

export async function hammer(url: string | ((n: number) => string), opts: { clients: number; seconds: number; headers?: Record<string, string> }): Promise<LoadResult> {
  const latencies: number[] = [];
  const failures = new Map<string, number>();
  const deadline = performance.now() + opts.seconds * 1000;
  let sent = 0;
  const client = async () => {
    while (performance.now() < deadline) {
      const started = performance.now();
      try {
        const response = await fetch(typeof url === "string" ? url : url(sent++), { headers: opts.headers });
        await response.arrayBuffer();
        if (!response.ok) failures.set(String(response.status), (failures.get(String(response.status)) ?? 0) + 1);
      } catch (error) {
        const key = (error as Error).message;
        failures.set(key, (failures.get(key) ?? 0) + 1);
      }
      latencies.push(performance.now() - started);
    }
  };
  const started = performance.now();
  await Promise.all(Array.from({ length: opts.clients }, client));
  const elapsedS = (performance.now() - started) / 1000;
  latencies.sort((a, b) => a - b);
  return { requests: latencies.length, perSecond: latencies.length / elapsedS, p50: percentile(latencies, 50), p95: percentile(latencies, 95), failures };
}

export const loadHeader = () => `${"target".padEnd(30)} ${"requests".padStart(8)} ${"req/s".padStart(8)} ${"p50 ms".padStart(8)} ${"p95 ms".padStart(8)}   errors`;

export function loadRow(name: string, result: LoadResult): string {
  const failures = [...result.failures].map(([k, n]) => `${k}×${n}`).join(", ") || "none";
  return `${name.padEnd(30)} ${String(result.requests).padStart(8)} ${result.perSecond.toFixed(1).padStart(8)} ${result.p50.toFixed(1).padStart(8)} ${result.p95.toFixed(1).padStart(8)}   ${failures}`;
}
