/**
 * The one role → permission table. Route handlers and server actions ask
 * `can(role, permission)` through the auth helper; navigation is derived from
 * the same table so a link is never shown for a screen the role cannot open.
 * (Pure data: imported by server code and by the navigation component.)
 */
export const roles = ["admin", "engineer", "reviewer", "customer"] as const;
export type Role = (typeof roles)[number];

export const permissions = [
  "device:read",
  "device:write",
  "measurement:upload",
  "measurement:approve",
  "sheet:write",
  "sheet:review",
  "revision:withdraw",
  "user:manage",
  "instrument:manage",
  "token:manage",
  "catalog:read",
  "subscription:manage",
] as const;
export type Permission = (typeof permissions)[number];

const table: Record<Role, readonly Permission[]> = {
  admin: ["device:read", "revision:withdraw", "user:manage", "instrument:manage", "token:manage", "catalog:read"],
  engineer: ["device:read", "device:write", "measurement:upload", "sheet:write", "catalog:read"],
  reviewer: ["device:read", "measurement:approve", "sheet:review", "revision:withdraw", "catalog:read"],
  customer: ["catalog:read", "subscription:manage"],
};

export function can(role: Role, permission: Permission): boolean {
  return table[role].includes(permission);
}

/** True when the role holds the permission, or one of the permissions of a list. */
export function canAny(role: Role, needed: Permission | readonly Permission[]): boolean {
  return (typeof needed === "string" ? [needed] : needed).some((p) => can(role, p));
}

export function permissionsOf(role: Role): readonly Permission[] {
  return table[role];
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (roles as readonly string[]).includes(value);
}

/** Sheet drafts are written by engineers and read by reviewers: either permission opens them. */
export const sheetDraftReaders: readonly Permission[] = ["sheet:write", "sheet:review"];

/** A link shows when the role holds one of its permissions (null: always). */
export type NavItem = { href: string; label: string; permission: Permission | readonly Permission[] | null };

/** Workspace navigation, in order; an item shows when the role holds its permission. */
export const workspaceNav: readonly NavItem[] = [
  { href: "/devices", label: "Devices", permission: "device:read" },
  { href: "/sheets", label: "Sheets", permission: sheetDraftReaders },
  { href: "/review", label: "Review queue", permission: "measurement:approve" },
  { href: "/admin/users", label: "People", permission: "user:manage" },
  { href: "/admin/instruments", label: "Instruments", permission: "instrument:manage" },
  { href: "/admin/bench-tokens", label: "Bench tokens", permission: "token:manage" },
  { href: "/catalog", label: "Catalog", permission: "catalog:read" },
  { href: "/subscriptions", label: "Change notices", permission: "subscription:manage" },
];

export function navigationFor(role: Role | null): NavItem[] {
  if (!role) return [{ href: "/catalog", label: "Catalog", permission: null }];
  return workspaceNav.filter((item) => item.permission === null || canAny(role, item.permission));
}
