import "server-only";
import { headers } from "next/headers";
import { ZodError, type ZodType } from "zod";
import { AppError, isAppError } from "@/lib/errors";
import { isPublic, resources, type Resource } from "@/lib/access/matrix";
import { serverConfig } from "../config";
import { authorize } from "./authorize";
import { getSessionUser, type SessionUser } from "./session";
import { databaseUnavailable, isDatabaseUnavailable } from "../db/database-unavailable";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses a state-changing request sent by a browser from another site. Browsers send
 * `Origin` on every cross-origin POST/PATCH/DELETE; it must name this app.
 */
export function assertSameOrigin(method: string, requestHeaders: Headers): void {
  if (SAFE_METHODS.has(method.toUpperCase())) return;
  const origin = requestHeaders.get("origin");
  const fetchSite = requestHeaders.get("sec-fetch-site");
  if (!origin) {
    if (fetchSite === "cross-site") throw new AppError("forbidden", "Cross-site request refused.");
    return;
  }
  const allowed = new Set<string>([new URL(serverConfig.appUrl).origin]);
  const host = requestHeaders.get("x-forwarded-host") ?? requestHeaders.get("host");
  if (host) {
    const proto = requestHeaders.get("x-forwarded-proto") ?? new URL(serverConfig.appUrl).protocol.replace(":", "");
    allowed.add(`${proto}://${host}`);
  }
  if (!allowed.has(origin)) throw new AppError("forbidden", `Cross-site request from ${origin} refused.`);
}

/** Session → the resource's permission. Throws 401 when signed out, 403 when the role may not use it. */
export async function requireAccess(resource: Resource): Promise<SessionUser> {
  return authorize(await getSessionUser(), resource);
}

const noStore = { "cache-control": "no-store" };

export function errorResponse(error: unknown): Response {
  if (isAppError(error)) return Response.json(error.toJSON(), { status: error.status, headers: noStore });
  if (error instanceof ZodError) return Response.json(validationError(error).toJSON(), { status: 422, headers: noStore });
  if (isDatabaseUnavailable(error)) {
    console.error("[benchfold] database unavailable:", error instanceof Error ? error.message : error);
    return Response.json(databaseUnavailable().toJSON(), { status: 503, headers: { ...noStore, "retry-after": "30" } });
  }
  console.error("[benchfold] unexpected error", error);
  return Response.json(new AppError("internal", "Something went wrong on our side.").toJSON(), { status: 500, headers: noStore });
}

/**
 * What a route handler answers is private unless it says otherwise: JSON behind a session or
 * a bench token, and the public routes' answers too (invitation details, sign-up and reset
 * results). A handler that sets its own Cache-Control keeps it (the PDF: private, revalidated
 * by ETag).
 */
function withDefaultCaching(response: Response): Response {
  if (response.headers.has("cache-control")) return response;
  // A copy: the headers of a Response.redirect() cannot be changed in place.
  const headers = new Headers(response.headers);
  headers.set("cache-control", noStore["cache-control"]);
  return new Response(response.body, { status: response.status, statusText: response.statusText, headers });
}

function validationError(error: ZodError): AppError {
  const fields = error.issues.map((issue) => ({ field: issue.path.join(".") || "(body)", message: issue.message }));
  const first = fields[0];
  return new AppError("invalid", first ? `${first.field}: ${first.message}` : "Invalid input.", { fields });
}

type RouteContext = { params: Promise<Record<string, string | string[]>> };

type HandlerArgs<B, U> = { user: U; body: B; params: Record<string, string>; request: Request };

type RouteOptions<B, R extends Resource> = { resource: R; body?: ZodType<B>; maxBodyBytes?: number };

/** A public resource's handler may be called signed out. */
type UserOf<R extends Resource> = (typeof resources)[R]["access"] extends "public" ? SessionUser | null : SessionUser;

/**
 * The one wrapper for route handlers: origin check → session → the resource's permission
 * (lib/access/matrix.ts, the row the route tree test holds this file to) → validated input →
 * the handler. Organization scope is the handler's `where`, using `user.organizationId`.
 * A returned plain object becomes JSON.
 */
export function route<B = undefined, R extends Resource = Resource>(
  options: RouteOptions<B, R>,
  handler: (args: HandlerArgs<B, UserOf<R>>) => Promise<unknown>,
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      assertSameOrigin(request.method, request.headers);
      const user = isPublic(options.resource) ? await getSessionUser() : await requireAccess(options.resource);
      const body = options.body ? await readJsonBody(request, options.body, options.maxBodyBytes ?? 64 * 1024) : (undefined as B);
      const raw = (await context?.params) ?? {};
      const params = Object.fromEntries(Object.entries(raw).map(([k, v]) => [k, Array.isArray(v) ? v.join("/") : v]));
      const result = await handler({ user: user as never, body, params, request });
      return withDefaultCaching(result instanceof Response ? result : Response.json(result ?? { ok: true }));
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/**
 * For route handlers that authenticate without a session (the bench API's bearer token, which
 * the handler checks itself): the same error answers and caching as route().
 */
export function tokenRoute(handler: (request: Request, context?: RouteContext) => Promise<Response>) {
  return async (request: Request, context?: RouteContext): Promise<Response> => {
    try {
      return withDefaultCaching(await handler(request, context));
    } catch (error) {
      return errorResponse(error);
    }
  };
}

async function readJsonBody<B>(request: Request, schema: ZodType<B>, maxBytes: number): Promise<B> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > maxBytes) throw new AppError("payload-too-large", `Request body over ${maxBytes} bytes.`);
  const type = request.headers.get("content-type") ?? "";
  if (!type.includes("application/json")) throw new AppError("unsupported-media-type", "Send the body as application/json.");
  const text = await request.text();
  if (Buffer.byteLength(text) > maxBytes) throw new AppError("payload-too-large", `Request body over ${maxBytes} bytes.`);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new AppError("bad-request", "The body is not valid JSON.");
  }
  return schema.parse(json);
}

/** The same chain for server actions: errors come back as a value the form can show. */
export async function runAction<B, R>(
  options: { resource: Resource; input: unknown; schema: ZodType<B> },
  fn: (args: { user: SessionUser; input: B }) => Promise<R>,
): Promise<{ ok: true; value: R } | { ok: false; code: string; message: string }> {
  try {
    const h = await headers();
    assertSameOrigin("POST", h);
    const user = await requireAccess(options.resource);
    const input = options.schema.parse(options.input);
    return { ok: true, value: await fn({ user, input }) };
  } catch (error) {
    const appError = isAppError(error) ? error : error instanceof ZodError ? validationError(error) : null;
    if (!appError) {
      console.error("[benchfold] unexpected error in action", error);
      return { ok: false, code: "internal", message: "Something went wrong on our side." };
    }
    return { ok: false, code: appError.code, message: appError.message };
  }
}
