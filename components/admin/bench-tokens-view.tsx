import type { BenchTokenSummary } from "@/lib/domain/instruments";
import { PageHeader } from "@/components/ui/page-header";
import { BenchTokensPanel } from "./bench-tokens-panel";

export function BenchTokensView({ organizationName, tokens, appOrigin }: { organizationName: string; tokens: BenchTokenSummary[]; appOrigin: string }) {
  return (
    <>
      <PageHeader
        runningHead={organizationName}
        title="Bench tokens"
        lead="Tokens let a test bench upload measurement files to your organization through the API. Each is shown once when created; revoke one the moment a bench is retired or a token leaks."
      />
      <BenchTokensPanel initialTokens={tokens} appOrigin={appOrigin} />
    </>
  );
}
