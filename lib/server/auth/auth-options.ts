import "server-only";
import { randomUUID } from "node:crypto";
import bcrypt from "bcryptjs";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/models";
import { hashPassword, needsRehash, passwordHashCost } from "../accounts/hash-password";
import { recordAuditEvent } from "../audit/record-audit-event";
import { serverConfig } from "../config";
import { isRole } from "@/lib/domain/permissions";
import { clientAddress, isSignInThrottled, recordSignInAttempt } from "./rate-limit";
import { revokeSession } from "./revoke-session";

/** Codes the sign-in form turns into words (next-auth passes the thrown message through as `error`). */
export const signInErrors = { invalid: "invalid-credentials", throttled: "too-many-attempts" } as const;

// Compared against when the account does not exist, so timing does not reveal which e-mails are
// registered: at the cost of stored hashes (it was 10 against stored 11, half the time).
const decoyHash = bcrypt.hashSync("benchfold-decoy-password", passwordHashCost);

export const authOptions: NextAuthOptions = {
  secret: process.env.NEXTAUTH_SECRET,
  session: { strategy: "jwt", maxAge: serverConfig.sessionMaxAgeSeconds },
  // Secure cookies (with next-auth's __Secure-/__Host- name prefixes) exactly when the app is
  // served over HTTPS, as NEXTAUTH_URL states. next-auth's own default, written out so that no
  // change of how the URL is found can send a session cookie over plain HTTP.
  useSecureCookies: serverConfig.secureCookies,
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        const { User } = db();
        const email = String(credentials?.email ?? "").trim().toLowerCase();
        const password = String(credentials?.password ?? "");
        if (!email || !password) throw new Error(signInErrors.invalid);
        const address = clientAddress(req?.headers as Record<string, string> | undefined);
        if (await isSignInThrottled(email, address)) throw new Error(signInErrors.throttled);
        const user = await User.findOne({ where: { email } });
        const matches = await bcrypt.compare(password, user?.passwordHash ?? decoyHash);
        const ok = Boolean(user && matches && !user.disabledAt);
        await recordSignInAttempt(email, address, ok);
        if (!ok || !user) throw new Error(signInErrors.invalid);
        if (needsRehash(user.passwordHash)) {
          // The password was just checked, so it can be stored again at today's cost; the same
          // password, so no session ends. Only while the stored hash is still the one checked.
          const passwordHash = await hashPassword(password);
          await db().sequelize.transaction(async (transaction) => {
            const [changed] = await User.update(
              { passwordHash, lastSignInAt: new Date() },
              { where: { id: user.id, passwordHash: user.passwordHash }, transaction },
            );
            if (changed) {
              await recordAuditEvent(
                { organizationId: user.organizationId, actorUserId: user.id, action: "account.password-rehashed", subjectType: "user", subjectId: user.id,
                  before: { bcryptCost: bcrypt.getRounds(user.passwordHash) }, after: { bcryptCost: passwordHashCost } },
                transaction,
              );
            }
          });
        } else {
          await user.update({ lastSignInAt: new Date() });
        }
        return {
          id: String(user.id),
          email: user.email,
          name: user.name,
          role: user.role,
          organizationId: user.organizationId,
          tokenVersion: user.tokenVersion,
        };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.userId = Number(user.id);
        token.role = user.role;
        token.organizationId = user.organizationId;
        token.tokenVersion = user.tokenVersion;
        token.sessionId = randomUUID();
        token.sessionStartedAt = Math.floor(Date.now() / 1000);
      }
      return token;
    },
    async session({ session, token }) {
      if (token.userId && isRole(token.role)) {
        session.user = {
          id: token.userId,
          email: token.email ?? "",
          name: token.name ?? "",
          role: token.role,
          organizationId: token.organizationId ?? 0,
          tokenVersion: token.tokenVersion ?? 0,
          sessionId: token.sessionId ?? "",
          sessionStartedAt: token.sessionStartedAt ?? 0,
        };
      }
      return session;
    },
  },
  events: {
    // next-auth's own sign-out endpoint (POST /api/auth/signout) ends the session on the server
    // too, as app/api/auth/sign-out does for the Sign out button.
    async signOut({ token }) {
      if (token?.sessionId && token.userId && token.sessionStartedAt) {
        await revokeSession({ sessionId: token.sessionId, userId: token.userId, startedAt: token.sessionStartedAt });
      }
    },
  },
};
