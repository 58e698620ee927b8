import { candidateDigestLabel, signedAtText } from "@/lib/sheet/release-text";
import type { SheetModel, SheetRelease, SheetSignature } from "@/lib/sheet/types";
import { Notation } from "./notation";
import { SheetHeading } from "./sheet-heading";

type ModelProps = { model: SheetModel };

/** "BF-… at https://…": the reference in figures, the address as a link. */
function VerificationPointer({ release }: { release: SheetRelease }) {
  return (
    <>
      <span className="figure text-ink">{release.verificationReference}</span> at{" "}
      <a href={release.verificationUrl} className="break-all underline decoration-rule-strong underline-offset-2">
        {release.verificationUrl}
      </a>
    </>
  );
}

/**
 * One electronic signature as printed: printed name, role, organization, UTC date and time and
 * meaning (21 CFR Part 11 §11.50), and the full SHA-256 of the candidate it signs (§11.70).
 */
function SheetSignatureEntry({ signature }: { signature: SheetSignature }) {
  return (
    <li className="sheet-keep grid gap-x-8 gap-y-2 py-3 sm:gap-y-1 sm:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]" data-testid="sheet-signature">
      <div>
        <p className="text-sm text-ink-muted">Signed by</p>
        <p className="text-lg font-semibold">{signature.name}</p>
        <p>
          {signature.role}, {signature.organizationName}
        </p>
      </div>
      <div>
        <p className="text-sm text-ink-muted">Signed (UTC)</p>
        <p>
          <time dateTime={signature.signedAt} className="figure">
            {signedAtText(signature.signedAt)}
          </time>
        </p>
        <p>
          <span className="text-ink-muted">Meaning:</span> {signature.meaning}
        </p>
      </div>
      <p className="text-sm text-ink-muted sm:col-span-2">
        {candidateDigestLabel}: <code className="figure break-all text-ink">{signature.candidateDigest}</code>
      </p>
    </li>
  );
}

/** The release record of a released sheet: revision and date, where to verify it, the signatures, the release notes. */
export function SheetReleaseRecord({ model }: ModelProps) {
  const { release, header } = model;
  if (!release) return null;
  return (
    <section aria-labelledby="sheet-release" className="mt-10" data-testid="sheet-release">
      <SheetHeading id="sheet-release">Release and signatures</SheetHeading>
      <p className="max-w-prose">
        <span className="font-semibold">{header.revisionText}</span> of {header.partNumber}, released{" "}
        <time dateTime={release.releasedOn} className="figure">
          {release.releasedOn}
        </time>
        . Its public record: <VerificationPointer release={release} />.
      </p>
      <ol className="mt-4 max-w-4xl divide-y divide-rule border-y-[1.5px] border-ink">
        {release.signatures.map((signature, i) => (
          <SheetSignatureEntry key={i} signature={signature} />
        ))}
      </ol>
      <p className="mt-2 text-sm text-ink-muted">
        Signed electronically in Benchfold; each signature is bound to the reviewed candidate by the digest shown beside it.
      </p>
      {release.notes.length > 0 ? (
        <div className="sheet-keep mt-6 max-w-prose">
          <h3 className="font-semibold">Release notes, {header.revisionText}</h3>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {release.notes.map((note, i) => (
              <li key={i}>
                <Notation text={note} />
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}

/** The sheet's closing line, as the PDF's running foot: organization, part and revision, and on a released sheet where to verify it. */
export function SheetFoot({ model }: ModelProps) {
  const { header, release } = model;
  return (
    <footer className="mt-12 border-t border-rule pt-2 text-sm text-ink-muted" data-testid="sheet-foot">
      <p>
        {header.organizationName} · {header.partNumber} <span className={header.released ? "font-semibold text-ink" : ""}>{header.revisionText}</span>
      </p>
      {release ? (
        <p>
          Verify: <VerificationPointer release={release} />
        </p>
      ) : null}
    </footer>
  );
}
