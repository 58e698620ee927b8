import type { OrganizationKind } from "@/lib/domain/accounts";
import type { Role } from "@/lib/domain/permissions";

/** The signed-in person as every server function sees it: always read fresh from the database. */
export type SessionUser = {
  id: number;
  email: string;
  name: string;
  role: Role;
  organizationId: number;
  organizationName: string;
  organizationKind: OrganizationKind;
};
