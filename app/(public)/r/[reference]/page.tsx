import { permanentRedirect } from "next/navigation";
import { loadForPage } from "@/lib/server/auth/require-page-user";
import { findRevisionByReference } from "@/lib/server/reviews/list-revisions";

type Props = { params: Promise<{ reference: string }> };

/**
 * The verification reference printed in a released PDF's footer leads here: a permanent redirect
 * (308) to that revision's public page, whose address never changes; an unknown reference is a 404.
 */
export default async function VerificationReferencePage({ params }: Props) {
  const { reference } = await params;
  const revision = await loadForPage(() => findRevisionByReference(readable(reference).slice(0, 32)));
  permanentRedirect(revision.publicPath);
}

/** The reference as typed: percent-escapes undone, a malformed one left as it is (and so not found). */
function readable(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}
