import type { ZodError } from "zod";
import type { ApiError } from "@/components/api-client";

/** First message per field, from the shared schema on the client or the handler's 422 on the server. */
export function fieldErrorsOf(error: ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? "");
    if (key && !out[key]) out[key] = issue.message;
  }
  return out;
}

export function fieldErrorsOfApi(error: ApiError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of error.fields) if (!out[f.field]) out[f.field] = f.message;
  return out;
}
