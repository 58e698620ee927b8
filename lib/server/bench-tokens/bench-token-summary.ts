import "server-only";
import type { BenchToken } from "@/models";

export type BenchTokenSummary = { id: number; name: string; prefix: string; createdAt: string; lastUsedAt: string | null; revokedAt: string | null };

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
