import { formatByteSize } from "@/lib/format";

export type ReleasedDownloadsProps = {
  /** The revision's letter, for the words. */
  letter: string;
  csvPath: string;
  csvFileName: string;
  touchstone: { setId: number; serial: string; temperature: string; fileName: string; sizeBytes: number; path: string }[];
  /** Per condition measured on two or more units: the median unit, written by the engine. */
  medians: { groupId: string; temperature: string; serials: string[]; fileName: string; path: string }[];
};

/**
 * The released revision's data as files: the specification table as CSV and the raw Touchstone file of
 * every S-parameter set the revision rests on (none listed when it rests on none).
 */
export function ReleasedDownloads({ letter, csvPath, csvFileName, touchstone, medians }: ReleasedDownloadsProps) {
  return (
    <section aria-labelledby="released-downloads-heading" className="mb-6 text-[0.9375rem] print:hidden" data-testid="released-downloads">
      <h2 id="released-downloads-heading" className="running-head mb-2 !text-ink">
        Data of Rev. {letter}
      </h2>
      <ul className="space-y-1">
        <li>
          <a href={csvPath} download={csvFileName} data-testid="download-spec-csv">
            Specifications as CSV
          </a>{" "}
          <span className="figure text-[0.8125rem] text-ink-muted">{csvFileName}</span>
        </li>
        {medians.map((m) => (
          <li key={m.groupId}>
            <a href={m.path} download={m.fileName} data-testid="download-touchstone-median">
              S-parameters of the median unit of {m.serials.length}
              {m.temperature ? ` at ${m.temperature}` : ""} (Touchstone)
            </a>{" "}
            <span className="figure text-[0.8125rem] text-ink-muted">{m.fileName}</span>
          </li>
        ))}
        {touchstone.map((f) => (
          <li key={f.setId}>
            <a href={f.path} download={f.fileName} data-testid="download-touchstone">
              S-parameters of unit {f.serial}
              {f.temperature ? ` at ${f.temperature}` : ""} (Touchstone)
            </a>{" "}
            <span className="figure text-[0.8125rem] text-ink-muted">
              {f.fileName}, {formatByteSize(f.sizeBytes)}
            </span>
          </li>
        ))}
      </ul>
      {touchstone.length ? (
        <p className="mt-2 max-w-prose text-[0.8125rem] text-ink-muted">
          Each unit’s Touchstone file is the approved measurement as the bench recorded it, byte for byte.
          {medians.length
            ? " The median unit is written by Benchfold: at each frequency, the median across the units of |S| in dB and of the unwrapped phase, for simulating one typical part."
            : ""}
        </p>
      ) : null}
    </section>
  );
}
