/**
 * Organization kinds and the words for them and for the roles (the roles themselves and their
 * permissions are in ./permissions.ts). Pure: server code and client components import it.
 */
import type { Role } from "./permissions";

export const organizationKinds = ["vendor", "lab", "customer"] as const;
export type OrganizationKind = (typeof organizationKinds)[number];

export const organizationKindLabels: Record<OrganizationKind, string> = { vendor: "Component maker", lab: "Test laboratory", customer: "Customer" };

export const roleLabels: Record<Role, string> = {
  admin: "Administrator",
  engineer: "Engineer",
  reviewer: "Reviewer",
  customer: "Customer",
};


/** The mails anyone may ask the app to send to an address: counted per address and per recipient. */
export const accountMailKinds = ["sign-up", "password-reset"] as const;
export type AccountMailKind = (typeof accountMailKinds)[number];
