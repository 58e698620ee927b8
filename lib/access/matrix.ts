/**
 * The access matrix: every page and every API method of the app names the resource it serves,
 * and every resource names who may use it. A page and the route handler that serve the same
 * resource therefore ask the same question, through `requirePageUser({ resource })`,
 * `route({ resource })` and the resource's own function in `lib/server/` (which asks again
 * before it reads or writes). `tests/unit/access/route-tree.test.ts` walks `app/` and fails
 * when a page or a method has no row here, or names another resource than its row; the
 * integration tests derive who gets 200, 401 and 403 from these rows. Pure data: the
 * navigation and the client components may import it.
 */
import { canAny, roles, type Permission, type Role } from "@/lib/domain/permissions";

/**
 * "public": anyone, signed in or not; "signed-in": any session; "bench-token": a bench API token
 * in `Authorization`, never a session; otherwise a role holding the permission (or one of a list).
 */
export type Access = "public" | "signed-in" | "bench-token" | Permission | readonly Permission[];

export const resources = {
  catalog: { access: "public", what: "the home page and the public catalog of released sheets" },
  account: { access: "public", what: "sign-in and sign-out, sign-up, password reset and invitations: the way into and out of an account" },
  "dev-mailbox": { access: "public", what: "what the local fake SMTP server caught (exists only while it runs)" },
  session: { access: "signed-in", what: "who is signed in, and with which permissions" },
  devices: { access: "device:read", what: "the organization's devices, their measurement sets and the instruments they cite" },
  "device-edit": { access: "device:write", what: "registering and editing a device" },
  "measurement-upload": { access: "measurement:upload", what: "uploading a bench file from the browser, and the saved column mappings" },
  "measurement-review": { access: "measurement:approve", what: "the review queue and the decision on a submitted set (never one's own upload)" },
  "sheet-drafts": { access: ["sheet:write", "sheet:review"], what: "draft sheets: the index, the workspace, the model as JSON and the PDF" },
  "sheet-edit": { access: "sheet:write", what: "a draft's spec limits, prose and ratings" },
  "sheet-release": { access: "sheet:write", what: "submitting a draft for review, and releasing an approved candidate as a revision" },
  "sheet-review": { access: "sheet:review", what: "the sheet review queue and the decision on a candidate: changes requested, or approval with an electronic signature (never one's own submission)" },
  "sheet-comments": { access: ["sheet:write", "sheet:review"], what: "a candidate under review, its comment threads and their resolution" },
  conformity: { access: ["sheet:write", "sheet:review"], what: "a device's conformity watch since its current release: units inside each guaranteed limit, control charts, alerts" },
  "conformity-close": { access: "sheet:write", what: "closing a conformity alert with a reason" },
  "revision-withdrawal": { access: "revision:withdraw", what: "withdrawing a released revision, with a reason" },
  "released-sheets": { access: "public", what: "released revisions: the web sheet from the frozen model, the stored PDF, the verification reference" },
  people: { access: "user:manage", what: "the organization's people, their roles and invitations" },
  "instrument-admin": { access: "instrument:manage", what: "the instrument register and calibration dates" },
  "bench-tokens": { access: "token:manage", what: "the organization's bench API tokens" },
  "bench-upload": { access: "bench-token", what: "a bench posting a file with its token, and reading one of its organization's sets back (versioned API)" },
  subscriptions: { access: "subscription:manage", what: "the parts and device classes a customer follows, and the notices sent to them" },
  unsubscribe: { access: "public", what: "leaving a change notice by the signed link in its mail, without signing in" },
  service: { access: "public", what: "the service's own description and state: the OpenAPI document of api/v1, the liveness probe and the readiness probe" },
} as const satisfies Record<string, { access: Access; what: string }>;

export type Resource = keyof typeof resources;

/** Every page, by its route (route groups left out, dynamic segments as in the folder name). */
export const pageResources = {
  "/": "catalog",
  "/catalog": "catalog",
  "/sign-in": "account",
  "/sign-up": "account",
  "/sign-up/confirm/[token]": "account",
  "/password-reset": "account",
  "/password-reset/[token]": "account",
  "/invitations/[token]": "account",
  "/dev/mailbox": "dev-mailbox",
  "/devices": "devices",
  "/devices/[id]": "devices",
  "/devices/[id]/measurements/[setId]": "devices",
  "/review": "measurement-review",
  "/sheets": "sheet-drafts",
  "/sheets/[deviceId]": "sheet-drafts",
  "/review/sheets/[candidateId]": "sheet-comments",
  "/datasheets/[org]/[part]/[rev]": "released-sheets",
  "/r/[reference]": "released-sheets",
  "/verify": "released-sheets",
  "/compare": "released-sheets",
  "/unsubscribe/[token]": "unsubscribe",
  "/admin/users": "people",
  "/admin/instruments": "instrument-admin",
  "/admin/bench-tokens": "bench-tokens",
  "/subscriptions": "subscriptions",
} as const satisfies Record<string, Resource>;

/** Every exported method of every `app/api/**\/route.ts`, as "METHOD /api/path". */
export const apiResources = {
  "GET /api/auth/[...nextauth]": "account",
  "POST /api/auth/[...nextauth]": "account",
  "POST /api/auth/sign-out": "account",
  "POST /api/accounts": "account",
  "POST /api/accounts/confirm": "account",
  "GET /api/invitations/[token]": "account",
  "POST /api/invitations/accept": "account",
  "POST /api/password-resets": "account",
  "POST /api/password-resets/complete": "account",
  "GET /api/dev/mailbox": "dev-mailbox",
  "GET /api/me": "session",
  "GET /api/devices": "devices",
  "GET /api/devices/[id]": "devices",
  "GET /api/devices/[id]/measurements": "devices",
  "GET /api/measurements/[id]": "devices",
  "GET /api/measurements/[id]/file": "devices",
  "GET /api/instruments": "devices",
  "POST /api/devices": "device-edit",
  "PATCH /api/devices/[id]": "device-edit",
  "POST /api/devices/[id]/measurements": "measurement-upload",
  "GET /api/column-mappings": "measurement-upload",
  "POST /api/column-mappings": "measurement-upload",
  "GET /api/measurements/pending": "measurement-review",
  "POST /api/measurements/[id]/review": "measurement-review",
  "GET /api/devices/[id]/sheet": "sheet-drafts",
  "GET /api/devices/[id]/sheet/pdf": "sheet-drafts",
  "PUT /api/devices/[id]/sheet-content": "sheet-edit",
  "PUT /api/devices/[id]/spec-limits": "sheet-edit",
  "PUT /api/devices/[id]/design-data": "sheet-edit",
  "POST /api/devices/[id]/package-outline": "sheet-edit",
  "DELETE /api/devices/[id]/package-outline": "sheet-edit",
  "GET /api/devices/[id]/review": "sheet-comments",
  "POST /api/devices/[id]/candidates": "sheet-release",
  "POST /api/sheet-candidates/[id]/release": "sheet-release",
  "GET /api/sheet-candidates/pending": "sheet-review",
  "POST /api/sheet-candidates/[id]/decision": "sheet-review",
  "GET /api/sheet-candidates/[id]": "sheet-comments",
  "POST /api/sheet-candidates/[id]/comments": "sheet-comments",
  "POST /api/sheet-comments/[id]/resolve": "sheet-comments",
  "GET /api/devices/[id]/revisions": "devices",
  "POST /api/sheet-revisions/[id]/withdraw": "revision-withdrawal",
  "GET /api/devices/[id]/conformity": "conformity",
  "POST /api/conformity-alerts/[id]/close": "conformity-close",
  "GET /api/v1/sheets/[org]/[part]/[rev]/pdf": "released-sheets",
  "GET /api/v1/verify": "released-sheets",
  "GET /api/v1/compare/csv": "released-sheets",
  "GET /api/subscriptions": "subscriptions",
  "POST /api/subscriptions": "subscriptions",
  "DELETE /api/subscriptions/[id]": "subscriptions",
  "POST /api/unsubscribe": "unsubscribe",
  "GET /api/v1/sheets": "catalog",
  "GET /api/v1/sheets/[org]/[part]/[rev]": "released-sheets",
  "GET /api/v1/sheets/[org]/[part]/[rev]/design-in": "released-sheets",
  "GET /api/v1/sheets/[org]/[part]/[rev]/csv": "released-sheets",
  "GET /api/v1/sheets/[org]/[part]/[rev]/touchstone/[setId]": "released-sheets",
  "GET /api/v1/sheets/[org]/[part]/[rev]/touchstone/median/[group]": "released-sheets",
  "GET /api/admin/users": "people",
  "PATCH /api/admin/users/[id]": "people",
  "GET /api/admin/invitations": "people",
  "POST /api/admin/invitations": "people",
  "GET /api/admin/instruments": "instrument-admin",
  "POST /api/admin/instruments": "instrument-admin",
  "PATCH /api/admin/instruments/[id]": "instrument-admin",
  "GET /api/admin/bench-tokens": "bench-tokens",
  "POST /api/admin/bench-tokens": "bench-tokens",
  "DELETE /api/admin/bench-tokens/[id]": "bench-tokens",
  "POST /api/v1/measurements": "bench-upload",
  "GET /api/v1/measurements/[id]": "bench-upload",
  "GET /api/v1/openapi.json": "service",
  "GET /api/health/live": "service",
  "GET /api/health/ready": "service",
} as const satisfies Record<string, Resource>;

export type PageRoute = keyof typeof pageResources;
export type ApiRoute = keyof typeof apiResources;

/** Whether a signed-in role may use the resource. A bench-token resource admits no session. */
export function allows(role: Role, resource: Resource): boolean {
  const access: Access = resources[resource].access;
  if (access === "public" || access === "signed-in") return true;
  if (access === "bench-token") return false;
  return canAny(role, access);
}

/** The roles a resource admits, in the order of the role list. */
export function rolesAllowed(resource: Resource): Role[] {
  return roles.filter((role) => allows(role, resource));
}

/** True for a resource a signed-out visitor may use. */
export function isPublic(resource: Resource): boolean {
  return resources[resource].access === "public";
}
