import "server-only";

/** Server settings read from the environment; scripts/lib.sh supplies working defaults. */
export const serverConfig = {
  get appUrl(): string {
    return process.env.NEXTAUTH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
  },
  get fakeSmtp(): boolean {
    return process.env.BENCHFOLD_FAKE_SMTP === "1";
  },
  get mailboxUrl(): string | null {
    return this.fakeSmtp ? (process.env.BENCHFOLD_MAILBOX_URL ?? null) : null;
  },
  get trustProxy(): boolean {
    return process.env.BENCHFOLD_TRUST_PROXY === "1";
  },
  mailFrom: process.env.MAIL_FROM ?? "Benchfold <no-reply@benchfold.example>",
  /** Sign-in rate limit: failures allowed per window, per account and per address. */
  signInLimit: {
    windowMs: 15 * 60 * 1000,
    perAccount: Number(process.env.BENCHFOLD_SIGNIN_LIMIT_ACCOUNT ?? 5),
    perAddress: Number(process.env.BENCHFOLD_SIGNIN_LIMIT_ADDRESS ?? 30),
  },
  sessionMaxAgeSeconds: 8 * 60 * 60,
} as const;
