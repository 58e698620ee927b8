import { AppError } from "@/lib/errors";
import { route } from "@/lib/server/auth/guard";
import { findReleasedRevision } from "@/lib/server/reviews/list-revisions";
import { designInOutcome } from "@/lib/sheet/design-in";

export const dynamic = "force-dynamic";

/**
 * `GET /api/v1/sheets/{org}/{part}/{rev}/design-in?drive=+10 dBm&frequency=1 GHz`: conversion loss and
 * suppression (isolation for a mixer) read off the revision's released typical curves at a design's
 * drive and input frequency, with the method, the units' spread and the sheet's limits at those
 * conditions: the same function as the sheet page's calculator, over the frozen model only.
 * Units as typed (dBm by default for the drive; GHz, MHz, kHz or Hz for the frequency). Unreadable
 * input, a point outside the measured range and a sheet without such curves (a hybrid) are 422s
 * that name the field and, for a range, the range.
 */
export const GET = route({ resource: "released-sheets" }, async ({ params, request }) => {
  const search = new URL(request.url).searchParams;
  for (const field of ["drive", "frequency"] as const) {
    if (search.getAll(field).length > 1) throw new AppError("invalid", `Give ${field} once.`, { field });
  }
  const released = await findReleasedRevision({ organizationSlug: params.org, partNumber: params.part, revision: params.rev });
  const outcome = designInOutcome(released.model, { drive: search.get("drive"), frequency: search.get("frequency") });
  switch (outcome.kind) {
    case "blank":
      throw new AppError("invalid", "Ask with drive (e.g. +10 dBm) and frequency (e.g. 1 GHz).", {
        issues: [
          { field: "drive", message: "Drive level: enter your design's drive, such as +10 dBm." },
          { field: "frequency", message: "Input frequency: enter your design's input frequency, such as 1 GHz." },
        ],
      });
    case "issues":
      throw new AppError("invalid", outcome.issues.map((i) => i.message).join(" "), { issues: outcome.issues });
    case "refused": {
      const { code, field, message, range } = outcome.refusal;
      throw new AppError("invalid", message, { reason: code, field, ...(range ? { range } : {}) });
    }
  }
  const { summary } = released;
  return Response.json(
    {
      apiVersion: 1,
      revision: { organization: params.org, partNumber: released.model.header.partNumber, letter: summary.letter, standing: summary.standing, publicPath: summary.publicPath },
      designIn: outcome.answer,
    },
    // The frozen model never changes; the standing in the answer does, so it is revalidated like the sheet's JSON.
    { headers: { "cache-control": "public, no-cache" } },
  );
});
