import "server-only";

/** Server settings read from the environment; scripts/lib.sh supplies working defaults. */
export const serverConfig = {
  get appUrl(): string {
    return process.env.NEXTAUTH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
  },
  /** Served over HTTPS: session cookies are Secure and carry next-auth's `__Secure-` prefix. */
  get secureCookies(): boolean {
    return this.appUrl.startsWith("https://");
  },
  get fakeSmtp(): boolean {
    return process.env.BENCHFOLD_FAKE_SMTP === "1";
  },
  /**
   * The fake SMTP server's read-out, only while mail is caught on this machine: the fake is on,
   * and both the SMTP host the app sends to and the read-out are loopback addresses.
   */
  get mailboxUrl(): string | null {
    const url = process.env.BENCHFOLD_MAILBOX_URL;
    if (!this.fakeSmtp || !url) return null;
    const loopback = (host: string) => ["127.0.0.1", "localhost", "::1", "[::1]"].includes(host.toLowerCase());
    if (!loopback(process.env.SMTP_HOST ?? "127.0.0.1")) return null;
    try {
      return loopback(new URL(url).hostname) ? url : null;
    } catch {
      return null;
    }
  },
  mailFrom: process.env.MAIL_FROM ?? "Benchfold <no-reply@benchfold.example>",
  /** Sign-in rate limit: failures allowed per window, per account and per address. */
  signInLimit: {
    windowMs: 15 * 60 * 1000,
    perAccount: Number(process.env.BENCHFOLD_SIGNIN_LIMIT_ACCOUNT ?? 5),
    perAddress: Number(process.env.BENCHFOLD_SIGNIN_LIMIT_ADDRESS ?? 30),
  },
  /**
   * Sign-up and reset mails anyone may ask for: per recipient and per client address in a window.
   * Without it the forms would mail any address as often as a script likes.
   */
  accountMailLimit: {
    windowMs: 60 * 60 * 1000,
    perRecipient: Number(process.env.BENCHFOLD_ACCOUNT_MAIL_LIMIT_RECIPIENT ?? 5),
    perAddress: Number(process.env.BENCHFOLD_ACCOUNT_MAIL_LIMIT_ADDRESS ?? 20),
  },
  sessionMaxAgeSeconds: 8 * 60 * 60,
} as const;
