import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

type NotBuiltViewProps = { runningHead: string; title: string; lead: string; emptyTitle: string; children: React.ReactNode };

/** A workspace page whose work arrives in a later release: says so, and says what it will hold. */
export function NotBuiltView({ runningHead, title, lead, emptyTitle, children }: NotBuiltViewProps) {
  return (
    <>
      <PageHeader runningHead={runningHead} title={title} lead={lead} />
      <EmptyState title={emptyTitle}>{children}</EmptyState>
    </>
  );
}
