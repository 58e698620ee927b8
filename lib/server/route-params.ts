import "server-only";
import { AppError } from "@/lib/errors";

/** A positive integer id from the URL, or the same 404 an unknown id gets. */
export function readIdParam(value: string | undefined, what: string): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0 || id > 2 ** 32) throw new AppError("not-found", `No such ${what} in your organization.`);
  return id;
}
