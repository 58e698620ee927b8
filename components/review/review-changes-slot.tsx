import { Notice } from "@/components/ui/notice";

/**
 * DIFF SLOT: where the list of changes since the last release goes (components/review/sheet-diff.tsx
 * drawing diffSheetModels(previousModel, model)); until it is wired, says what it compares.
 */
export function ReviewChangesSlot({ comparedRevision }: { comparedRevision: string | null }) {
  return (
    <section aria-labelledby="changes-title" data-testid="changes-slot">
      <h2 id="changes-title" className="mb-3 text-xl font-semibold">
        {comparedRevision ? `What changed since Rev. ${comparedRevision}` : "What changed: first release"}
      </h2>
      <Notice>
        {comparedRevision
          ? `The change list against Rev. ${comparedRevision} is not drawn here yet.`
          : "A first release: there is no released revision to compare with, so everything on the candidate is new."}
      </Notice>
    </section>
  );
}
