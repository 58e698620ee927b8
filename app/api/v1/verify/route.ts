import { AppError } from "@/lib/errors";
import { referencePattern, sha256Pattern, type VerifyQuery } from "@/lib/domain/verify";
import { route } from "@/lib/server/auth/guard";
import { verifyPrintout } from "@/lib/server/reviews/verify-printout";
import type { VerifyResponse } from "@/lib/schemas/api-v1";

export const dynamic = "force-dynamic";

/**
 * `GET /api/v1/verify?sha256=<64 hex>` or `?reference=<XXXXX-XXXXX>`: which released revision a
 * printout is, and whether it is current, superseded or withdrawn. Anything else is a 422 that
 * says what is expected; an unknown hash or reference a 404.
 */
export const GET = route({ resource: "released-sheets" }, async ({ request }) => {
  const params = new URL(request.url).searchParams;
  const sha256 = params.getAll("sha256");
  const reference = params.getAll("reference");
  let query: VerifyQuery;
  if (sha256.length + reference.length !== 1) {
    throw new AppError("invalid", "Ask with exactly one of sha256 (the PDF's SHA-256, 64 hexadecimal digits) or reference (as printed in the PDF's footer, e.g. 7KQ2M-XR4TD).");
  } else if (sha256.length === 1) {
    if (!sha256Pattern.test(sha256[0])) throw new AppError("invalid", "sha256 must be 64 hexadecimal digits.", { field: "sha256" });
    query = { sha256: sha256[0].toLowerCase() };
  } else {
    if (!referencePattern.test(reference[0])) throw new AppError("invalid", "reference must be two groups of five letters or digits, as printed in the PDF's footer (e.g. 7KQ2M-XR4TD).", { field: "reference" });
    query = { reference: reference[0].toUpperCase() };
  }
  return { verification: await verifyPrintout(query) } satisfies VerifyResponse;
});
