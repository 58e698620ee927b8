import type { Metadata } from "next";
import { listBenchTokens } from "@/lib/server/bench-tokens/list-bench-tokens";
import { serverConfig } from "@/lib/server/config";
import { requirePageUser } from "@/lib/server/auth/require-page-user";
import { BenchTokensView } from "@/components/admin/bench-tokens-view";

export const metadata: Metadata = { title: "Bench tokens" };

export default async function BenchTokensPage() {
  const user = await requirePageUser({ resource: "bench-tokens", path: "/admin/bench-tokens" });
  const tokens = await listBenchTokens(user.organizationId);
  return <BenchTokensView organizationName={user.organizationName} tokens={tokens} appOrigin={new URL(serverConfig.appUrl).origin} />;
}
