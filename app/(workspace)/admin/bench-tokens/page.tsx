import type { Metadata } from "next";
import { listBenchTokens } from "@/lib/server/bench-tokens/list-bench-tokens";
import { serverConfig } from "@/lib/server/config";
import { BenchTokensView } from "@/components/admin/bench-tokens-view";
import { ForbiddenView } from "@/components/workspace/forbidden-view";
import { requirePageUser } from "@/components/workspace/require-page-user";

export const metadata: Metadata = { title: "Bench tokens" };

export default async function BenchTokensPage() {
  const access = await requirePageUser({ permission: "token:manage", path: "/admin/bench-tokens" });
  if (!access.allowed) return <ForbiddenView role={access.user.role} pageName="bench tokens" />;
  const tokens = await listBenchTokens(access.user.organizationId);
  return <BenchTokensView organizationName={access.user.organizationName} tokens={tokens} appOrigin={new URL(serverConfig.appUrl).origin} />;
}
