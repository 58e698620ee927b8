/** The client side of the route handlers' error shape: `{ error: { code, message, details? } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: { field: string; message: string }[] = [],
  ) {
    super(message);
    this.name = "ApiError";
  }

  fieldError(field: string): string | undefined {
    return this.fields.find((f) => f.field === field)?.message;
  }
}

const fallbackMessages: Record<number, string> = {
  401: "Your session has ended. Sign in again.",
  403: "Your role does not allow this.",
  404: "Not found.",
  409: "That conflicts with what is already there.",
  422: "Some of what you entered is not valid.",
  429: "Too many attempts. Wait a few minutes and try again.",
};

export async function requestJson<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method: init.method ?? "GET",
      headers: init.body === undefined ? { accept: "application/json" } : { "content-type": "application/json", accept: "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: "same-origin",
      cache: "no-store",
    });
  } catch {
    throw new ApiError(0, "network", "Benchfold could not be reached. Check your connection and try again.");
  }
  const text = await response.text();
  let json: unknown = null;
  if (text) {
    try {
      json = JSON.parse(text);
    } catch {
      json = null;
    }
  }
  if (!response.ok) {
    const error = (json as { error?: { code?: string; message?: string; details?: { fields?: { field: string; message: string }[] } } } | null)?.error;
    throw new ApiError(
      response.status,
      error?.code ?? "unknown",
      error?.message ?? fallbackMessages[response.status] ?? `The server answered ${response.status}.`,
      error?.details?.fields ?? [],
    );
  }
  return json as T;
}

export function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : "Something went wrong.";
}
