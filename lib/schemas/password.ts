import { ZxcvbnFactory, type ZxcvbnResult } from "@zxcvbn-ts/core";
import { adjacencyGraphs, dictionary } from "@zxcvbn-ts/language-common";
import { z } from "zod";

/**
 * New passwords, as NIST SP 800-63B §5.1.1.2 (memorized secret verifiers) asks: at least 8
 * characters, at least 64 allowed, never truncated (bcrypt reads only the first 72 bytes, so the
 * limit is 72 bytes of UTF-8: 72 plain ASCII characters, fewer accented ones), every character
 * allowed, no composition rules,
 * and a check against commonly used, expected or compromised values, repetitive or sequential
 * characters and context-specific words (the service's name, the person's own name and
 * address). The check is the zxcvbn strength estimator (@zxcvbn-ts/core with the common
 * password, name and word lists of @zxcvbn-ts/language-common); a password must reach score 3
 * ("safely unguessable", about 10^8 guesses or more).
 */
export const minPasswordLength = 8;
/** bcrypt's input limit: a longer password would be cut short silently, which §5.1.1.2 forbids. */
export const maxPasswordBytes = 72;
export const minPasswordScore = 3;

/** Words about this service that make a password guessable here. */
const serviceWords = ["benchfold", "bench", "fold", "datasheet", "datasheets", "sheet", "rf"];

let estimator: ZxcvbnFactory | undefined;
function getEstimator(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({ dictionary: { ...dictionary, benchfold: serviceWords }, graphs: adjacencyGraphs });
  return estimator;
}

// The estimator's warning keys (translationKeys.warnings), in our words.
const warningWords: Partial<Record<string, string>> = {
  straightRow: "A row of keys on the keyboard is easy to guess.",
  keyPattern: "A short keyboard pattern is easy to guess.",
  simpleRepeat: "Repeated characters such as \"aaa\" are easy to guess.",
  extendedRepeat: "Repeated patterns such as \"abcabcabc\" are easy to guess.",
  sequences: "Sequences such as \"abc\" or \"6543\" are easy to guess.",
  recentYears: "Recent years are easy to guess.",
  dates: "Dates are easy to guess.",
  topTen: "This is one of the most used passwords.",
  topHundred: "This is a very often used password.",
  common: "This is a commonly used password.",
  similarToCommon: "This is close to a commonly used password.",
  wordByItself: "A single word is easy to guess.",
  namesByThemselves: "Names on their own are easy to guess.",
  commonNames: "Common names are easy to guess.",
  userInputs: "The password should not contain your name, your address or the service's name.",
};

export type PasswordVerdict = { score: number; ok: boolean; message?: string };

/** The estimator's verdict on a new password; `context` are the person's own words (name, e-mail, company). */
export function judgePassword(password: string, context: string[] = []): PasswordVerdict {
  const words = context.flatMap((c) => c.toLowerCase().split(/[^\p{L}\p{N}]+/u)).filter((w) => w.length >= 3);
  const result: ZxcvbnResult = getEstimator().check(password.slice(0, maxPasswordBytes), words);
  if (result.score >= minPasswordScore) return { score: result.score, ok: true };
  const warning = (result.feedback.warning && warningWords[result.feedback.warning]) || "This password is easy to guess.";
  return { score: result.score, ok: false, message: `${warning} Use a longer phrase of uncommon words.` };
}

/** A password being set (sign-up, reset, invitation): length, then the strength estimate. */
export function passwordBytes(password: string): number {
  return new TextEncoder().encode(password).length;
}

const tooLong = `Use at most ${maxPasswordBytes} bytes: ${maxPasswordBytes} plain letters, digits or spaces, fewer accented letters or symbols.`;

/** Within the length limits, so the estimator's verdict is the one thing left to say. */
function lengthFits(password: string): boolean {
  return password.length >= minPasswordLength && passwordBytes(password) <= maxPasswordBytes;
}

export const newPasswordSchema = z
  .string()
  .min(minPasswordLength, `Use at least ${minPasswordLength} characters.`)
  .refine((password) => passwordBytes(password) <= maxPasswordBytes, tooLong)
  .superRefine((password, ctx) => {
    if (!lengthFits(password)) return;
    const verdict = judgePassword(password);
    if (!verdict.ok) ctx.addIssue({ code: "custom", message: verdict.message! });
  });

/**
 * For a form that also names the person: the password must not be guessable from their own
 * name, address or company (NIST SP 800-63B §5.1.1.2, context-specific words).
 */
export function refinePasswordAgainstContext<T extends { password: string }>(contextOf: (value: T) => string[]) {
  return (value: T, ctx: z.RefinementCtx) => {
    if (!lengthFits(value.password)) return;
    if (!judgePassword(value.password).ok) return; // the field's own check said so already
    const verdict = judgePassword(value.password, contextOf(value));
    if (!verdict.ok) ctx.addIssue({ code: "custom", path: ["password"], message: verdict.message! });
  };
}
