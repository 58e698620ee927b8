import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

export function CatalogView() {
  return (
    <>
      <PageHeader
        runningHead="Public catalog"
        title="Released datasheets"
        lead="Every sheet an organization has reviewed and released, open to anyone, each revision fixed and downloadable as it was released."
      />
      <EmptyState title="No sheet has been released yet" testId="catalog-empty">
        <p>The catalog fills as organizations release sheets. Writing, reviewing and releasing sheets arrive in coming releases of Benchfold.</p>
        <p>Drafts are never shown here: only released revisions are public.</p>
      </EmptyState>
    </>
  );
}
