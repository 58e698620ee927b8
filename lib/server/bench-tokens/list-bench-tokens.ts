import "server-only";
import { db } from "@/models";
import { toBenchTokenSummary, type BenchTokenSummary } from "./bench-token-summary";

export async function listBenchTokens(organizationId: number): Promise<BenchTokenSummary[]> {
  const { BenchToken } = db();
  const rows = await BenchToken.findAll({ where: { organizationId }, order: [["createdAt", "DESC"]] });
  return rows.map(toBenchTokenSummary);
}
