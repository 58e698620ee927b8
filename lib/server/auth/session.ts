import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { db } from "@/models";
import type { User, Organization } from "@/models";
import { serverConfig } from "../config";
import { authOptions } from "./auth-options";
import { isSessionRevoked } from "./revoke-session";
import type { SessionUser } from "./session-user";

export type { SessionUser };

/** The request's session: who, and which sign-in (the id sign-out revokes). */
export type CurrentSession = { user: SessionUser; sessionId: string; startedAt: number };

/**
 * The session, checked against the database on every request: a signed-out session id, a
 * disabled account or a bumped token version ends it at once, and so does the session's
 * maximum age counted from sign-in; the role and organization always come from the database,
 * not from the token. A cookie without a session id (issued before sign-out could revoke one)
 * is refused, since it could never be ended.
 */
export const getCurrentSession = cache(async (): Promise<CurrentSession | null> => {
  const { Organization, User } = db();
  const session = await getServerSession(authOptions);
  const claims = session?.user;
  if (!claims?.id || !claims.sessionId || !claims.sessionStartedAt) return null;
  if (claims.sessionStartedAt + serverConfig.sessionMaxAgeSeconds <= Date.now() / 1000) return null;
  const [user, revoked] = await Promise.all([User.findByPk(claims.id, { include: [Organization] }), isSessionRevoked(claims.sessionId)]);
  if (revoked || !user || user.disabledAt || user.tokenVersion !== claims.tokenVersion) return null;
  const organization = (user as User & { Organization?: Organization }).Organization;
  if (!organization) return null;
  return {
    user: {
      id: user.id,
      email: user.email,
      name: user.name,
      role: user.role,
      organizationId: organization.id,
      organizationName: organization.name,
      organizationKind: organization.kind,
    },
    sessionId: claims.sessionId,
    startedAt: claims.sessionStartedAt,
  };
});

/** The signed-in user (see getCurrentSession), or null. */
export const getSessionUser = cache(async (): Promise<SessionUser | null> => (await getCurrentSession())?.user ?? null);
