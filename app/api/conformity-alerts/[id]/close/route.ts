import { closeConformityAlertBodySchema } from "@/lib/schemas/reviews";
import { route } from "@/lib/server/auth/guard";
import { closeConformityAlert } from "@/lib/server/conformity/close-conformity-alert";
import { readIdParam } from "@/lib/server/route-params";

/** Closes an open conformity alert with a reason (an engineer); audited. */
export const POST = route({ resource: "conformity-close", body: closeConformityAlertBodySchema }, async ({ user, params, body }) => ({
  alert: await closeConformityAlert({ actor: user, alertId: readIdParam(params.id, "conformity alert"), body }),
}));
