import "server-only";
import { BenchToken, getSequelize } from "@/models";
import { toBenchTokenSummary, type BenchTokenSummary } from "./bench-token-summary";

export async function listBenchTokens(organizationId: number): Promise<BenchTokenSummary[]> {
  getSequelize();
  const rows = await BenchToken.findAll({ where: { organizationId }, order: [["createdAt", "DESC"]] });
  return rows.map(toBenchTokenSummary);
}
