import { afterEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { ApiError } from "@/components/api-client";
import { checkInput, submitJsonForm, type FieldErrors, type JsonFormOptions } from "@/components/use-json-form";

const schema = z.object({ email: z.string().trim().toLowerCase().email("Enter a valid e-mail address."), name: z.string().min(1, "Enter a name.") });
type Body = z.infer<typeof schema>;

/** The state a form would show after one submit, and every pending value it went through. */
function recorder() {
  const state = { errors: {} as FieldErrors, formError: null as string | null, pending: [] as boolean[] };
  return {
    state,
    setters: {
      setErrors: (errors: FieldErrors) => void (state.errors = errors),
      setFormError: (message: string | null) => void (state.formError = message),
      setPending: (pending: boolean) => void state.pending.push(pending),
    },
  };
}

function answer(status: number, body: unknown) {
  const fetchMock = vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } }));
  vi.stubGlobal("fetch", fetchMock);
  return fetchMock;
}

function options(overrides: Partial<JsonFormOptions<Body, { id: number }>> = {}): JsonFormOptions<Body, { id: number }> {
  return {
    url: "/api/things",
    check: () => checkInput(schema, { email: " Ada@Example.COM ", name: "Ada" }),
    onSuccess: vi.fn(),
    ...overrides,
  };
}

afterEach(() => vi.unstubAllGlobals());

describe("checkInput", () => {
  it("gives the parsed body when the schema and the extra checks pass", () => {
    expect(checkInput(schema, { email: " Ada@Example.COM ", name: "Ada" }, { confirm: undefined })).toEqual({ body: { email: "ada@example.com", name: "Ada" } });
  });

  it("gives the first message per field, together with the extra errors", () => {
    expect(checkInput(schema, { email: "not-an-address", name: "" }, { confirm: "The two passwords differ." })).toEqual({
      errors: { email: "Enter a valid e-mail address.", name: "Enter a name.", confirm: "The two passwords differ." },
    });
  });

  it("refuses a valid body when an extra check fails", () => {
    expect(checkInput(schema, { email: "ada@example.com", name: "Ada" }, { confirm: "The two passwords differ." })).toEqual({
      errors: { confirm: "The two passwords differ." },
    });
  });
});

describe("submitJsonForm", () => {
  it("shows the check's errors and sends nothing", async () => {
    const fetchMock = answer(201, { id: 1 });
    const { state, setters } = recorder();
    const onSuccess = vi.fn();
    await submitJsonForm(options({ check: () => ({ errors: { name: "Enter a name." } }), onSuccess }), new FormData(), setters);
    expect(state).toEqual({ errors: { name: "Enter a name." }, formError: null, pending: [] });
    expect(fetchMock).not.toHaveBeenCalled();
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it("posts the checked body as JSON and hands the answer to onSuccess", async () => {
    const fetchMock = answer(201, { id: 7 });
    const { state, setters } = recorder();
    const onSuccess = vi.fn();
    await submitJsonForm(options({ onSuccess, method: "PATCH" }), new FormData(), setters);
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe("/api/things");
    expect(init.method).toBe("PATCH");
    expect(JSON.parse(String(init.body))).toEqual({ email: "ada@example.com", name: "Ada" });
    expect(onSuccess).toHaveBeenCalledWith({ id: 7 }, { email: "ada@example.com", name: "Ada" });
    expect(state).toEqual({ errors: {}, formError: null, pending: [true, false] });
  });

  it("keeps the button pending after success when the form leaves", async () => {
    answer(201, { id: 7 });
    const { state, setters } = recorder();
    await submitJsonForm(options({ keepPendingOnSuccess: true }), new FormData(), setters);
    expect(state.pending).toEqual([true]);
  });

  it("puts a 422's field details under their fields and the message on the general line", async () => {
    answer(422, { error: { code: "invalid-input", message: "Check the highlighted fields.", details: { fields: [{ field: "email", message: "Already in use." }] } } });
    const { state, setters } = recorder();
    const onSuccess = vi.fn();
    await submitJsonForm(options({ onSuccess, keepPendingOnSuccess: true }), new FormData(), setters);
    expect(state).toEqual({ errors: { email: "Already in use." }, formError: "Check the highlighted fields.", pending: [true, false] });
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it("lets the form word the general line itself", async () => {
    answer(404, { error: { code: "not-found", message: "Not found." } });
    const { state, setters } = recorder();
    const errorMessage = (error: unknown) => (error instanceof ApiError && error.status === 404 ? "This link is unknown." : "other");
    await submitJsonForm(options({ errorMessage }), new FormData(), setters);
    expect(state.formError).toBe("This link is unknown.");
  });

  it("says so when the server cannot be reached, and when onSuccess fails", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Promise.reject(new TypeError("Failed to fetch"))));
    const first = recorder();
    await submitJsonForm(options(), new FormData(), first.setters);
    expect(first.state).toEqual({ errors: {}, formError: "Benchfold could not be reached. Check your connection and try again.", pending: [true, false] });

    answer(201, { id: 7 });
    const second = recorder();
    const onSuccess = async () => Promise.reject(new Error("Sign-in did not answer."));
    await submitJsonForm(options({ onSuccess, keepPendingOnSuccess: true }), new FormData(), second.setters);
    expect(second.state).toEqual({ errors: {}, formError: "Sign-in did not answer.", pending: [true, false] });
  });
});
