"use client";

import { useState, type FormEvent } from "react";
import type { ZodType } from "zod";
import { ApiError, messageOf, requestJson } from "./api-client";
import { fieldErrorsOf, fieldErrorsOfApi } from "./auth/zod-errors";

/** One message per field name, as the fields show them. */
export type FieldErrors = Record<string, string>;

/** What a form's own check makes of its input: the body to send, or the errors to show. */
export type FormCheck<TBody> = { body: TBody; errors?: undefined } | { body?: undefined; errors: FieldErrors };

export type JsonFormOptions<TBody, TResult> = {
  url: string;
  method?: "POST" | "PATCH" | "PUT";
  /** Reads and checks the input when the form is submitted; controlled forms may ignore `form`. */
  check: (form: FormData) => FormCheck<TBody>;
  onSuccess: (result: TResult, body: TBody) => void | Promise<void>;
  /** `onSuccess` leaves (another page, a fresh form): the button stays disabled until it goes. */
  keepPendingOnSuccess?: boolean;
  /** The general error line for a failed request; the server's message by default. */
  errorMessage?: (error: unknown) => string;
};

export type JsonFormSetters = {
  setErrors: (errors: FieldErrors) => void;
  setFormError: (message: string | null) => void;
  setPending: (pending: boolean) => void;
};

/** A schema check plus extra errors the schema cannot see (e.g. the repeated password). */
export function checkInput<T>(schema: ZodType<T>, input: unknown, extra: Record<string, string | undefined> = {}): FormCheck<T> {
  const parsed = schema.safeParse(input);
  const errors = parsed.success ? {} : fieldErrorsOf(parsed.error);
  for (const [field, message] of Object.entries(extra)) if (message) errors[field] = message;
  return parsed.success && Object.keys(errors).length === 0 ? { body: parsed.data } : { errors };
}

/**
 * One submit: check, post JSON, then success or the server's `{ error: { code, message, details } }`
 * shown as field errors (a 422's `details.fields`) and one general line.
 */
export async function submitJsonForm<TBody, TResult>(options: JsonFormOptions<TBody, TResult>, form: FormData, state: JsonFormSetters): Promise<void> {
  state.setFormError(null);
  const checked = options.check(form);
  state.setErrors(checked.errors ?? {});
  if (checked.errors) return;
  const body = checked.body;
  state.setPending(true);
  try {
    const result = await requestJson<TResult>(options.url, { method: options.method ?? "POST", body });
    await options.onSuccess(result, body);
    if (!options.keepPendingOnSuccess) state.setPending(false);
  } catch (error) {
    if (error instanceof ApiError) state.setErrors(fieldErrorsOfApi(error));
    state.setFormError((options.errorMessage ?? messageOf)(error));
    state.setPending(false);
  }
}

/** A form that posts JSON to a route handler: its field errors, general error line and pending state. */
export function useJsonForm<TBody, TResult = unknown>(options: JsonFormOptions<TBody, TResult>) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  function submit(event: FormEvent<HTMLFormElement>): Promise<void> {
    event.preventDefault();
    return submitJsonForm(options, new FormData(event.currentTarget), { setErrors, setFormError, setPending });
  }

  return { errors, formError, pending, submit };
}
