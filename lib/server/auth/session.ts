import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { Organization, User, getSequelize } from "@/models";
import { authOptions } from "./auth-options";
import type { SessionUser } from "./session-user";

export type { SessionUser };

/**
 * The signed-in user, checked against the database on every request: a disabled
 * account or a bumped token version ends the session at once, and the role and
 * organization always come from the database, not from the token.
 */
export const getSessionUser = cache(async (): Promise<SessionUser | null> => {
  const session = await getServerSession(authOptions);
  const claims = session?.user;
  if (!claims?.id) return null;
  getSequelize();
  const user = await User.findByPk(claims.id, { include: [Organization] });
  if (!user || user.disabledAt || user.tokenVersion !== claims.tokenVersion) return null;
  const organization = (user as User & { Organization?: Organization }).Organization;
  if (!organization) return null;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organizationId: organization.id,
    organizationName: organization.name,
    organizationKind: organization.kind,
  };
});
