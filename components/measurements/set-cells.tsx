import Link from "next/link";
import type { MeasurementSetSummary } from "@/lib/domain/measurements";
import { formatDateTime } from "@/lib/format";

/** "#12", linked to the set's own page. */
export function SetLink({ deviceId, setId }: { deviceId: number; setId: number }) {
  return (
    <Link href={`/devices/${deviceId}/measurements/${setId}`} className="figure font-semibold">
      #{setId}
    </Link>
  );
}

/** The uploaded file's name, cut to the column's width; the whole name on hover. */
export function SetFileCell({ fileName, maxWidthClass }: { fileName: string; maxWidthClass: string }) {
  return (
    <td className={`${maxWidthClass} truncate`} title={fileName}>
      <span className="figure text-[0.875rem]">{fileName}</span>
    </td>
  );
}

/** Who uploaded the set (a person, or the bench token that sent it) and when. */
export function SetUploadedCell({ set }: { set: Pick<MeasurementSetSummary, "uploadedBy" | "source" | "benchTokenName" | "createdAt"> }) {
  return (
    <td className="whitespace-nowrap text-[0.875rem]">
      {set.uploadedBy ?? (set.source === "bench-api" ? `Bench token “${set.benchTokenName ?? "removed"}”` : "—")}
      <br />
      <span className="figure text-ink-muted">{formatDateTime(set.createdAt)}</span>
    </td>
  );
}
