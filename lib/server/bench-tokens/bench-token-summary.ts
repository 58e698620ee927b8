import "server-only";
import type { BenchToken } from "@/models";
import type { BenchTokenSummary } from "@/lib/domain/instruments";

export type { BenchTokenSummary };

export function toBenchTokenSummary(t: BenchToken): BenchTokenSummary {
  return {
    id: t.id,
    name: t.name,
    prefix: t.tokenPrefix,
    createdAt: t.createdAt.toISOString(),
    lastUsedAt: t.lastUsedAt ? t.lastUsedAt.toISOString() : null,
    revokedAt: t.revokedAt ? t.revokedAt.toISOString() : null,
  };
}
