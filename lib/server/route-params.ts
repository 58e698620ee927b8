import "server-only";
import { AppError } from "@/lib/errors";
import { parseRecordId } from "@/lib/schemas/decimal";

/** A positive integer id from the URL in plain decimal digits, or the same 404 an unknown id gets. */
export function readIdParam(value: string | undefined, what: string): number {
  const id = parseRecordId(value);
  if (id === undefined) throw new AppError("not-found", `No such ${what} in your organization.`);
  return id;
}
