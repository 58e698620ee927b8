import { RevisionHistoryTable, type RevisionHistoryTableProps } from "./revision-history-table";
import { WithdrawRevisionForm } from "./withdraw-revision-form";

type RevisionHistoryProps = Omit<RevisionHistoryTableProps, "withdrawControl"> & {
  /** The viewer may withdraw a revision (a reviewer or administrator of its organization). */
  canWithdraw?: boolean;
};

/** The revision history of the workspace (device page, sheet workspace), with *Withdraw…* for a role allowed it. */
export function RevisionHistory({ canWithdraw = false, ...table }: RevisionHistoryProps) {
  return <RevisionHistoryTable {...table} withdrawControl={canWithdraw ? (r) => <WithdrawRevisionForm revisionId={r.id} letter={r.letter} /> : undefined} />;
}
