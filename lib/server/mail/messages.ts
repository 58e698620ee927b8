import "server-only";
import type { OutgoingMail } from "./send-mail";

const roleWords: Record<string, string> = {
  admin: "an administrator",
  engineer: "an engineer",
  reviewer: "a reviewer",
  customer: "a customer",
};

export function invitationMail(opts: { to: string; organizationName: string; inviterName: string; role: string; link: string; expiresAt: Date }): OutgoingMail {
  const text = [
    `${opts.inviterName} invited you to join ${opts.organizationName} on Benchfold as ${roleWords[opts.role] ?? opts.role}.`,
    "",
    `Accept the invitation and choose a password: ${opts.link}`,
    "",
    `The link works once and expires on ${opts.expiresAt.toISOString().slice(0, 16).replace("T", " ")} UTC.`,
    "If you did not expect this, ignore this message.",
  ].join("\n");
  return { to: opts.to, subject: `Invitation to ${opts.organizationName} on Benchfold`, text };
}

export function passwordResetMail(opts: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  const text = [
    "Someone asked to reset the password of your Benchfold account.",
    "",
    `Choose a new password: ${opts.link}`,
    "",
    `The link works once and expires on ${opts.expiresAt.toISOString().slice(0, 16).replace("T", " ")} UTC.`,
    "If it was not you, ignore this message; your password stays as it is.",
  ].join("\n");
  return { to: opts.to, subject: "Reset your Benchfold password", text };
}

const utcMinute = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

export function signUpConfirmationMail(opts: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  const text = [
    "Someone, probably you, asked for a Benchfold customer account with this address.",
    "",
    `Confirm the address and create the account: ${opts.link}`,
    "",
    `The link works once and expires on ${utcMinute(opts.expiresAt)}.`,
    "If it was not you, ignore this message; no account is made without the link.",
  ].join("\n");
  return { to: opts.to, subject: "Confirm your Benchfold account", text };
}

/** Sent instead of a confirmation when the address has an account: the sign-up answer is the same. */
export function signUpExistingAccountMail(opts: { to: string; signInLink: string; resetLink: string }): OutgoingMail {
  const text = [
    "Someone tried to create a Benchfold account with this address, but it has an account already.",
    "",
    `If it was you, sign in: ${opts.signInLink}`,
    `or, if you forgot the password, reset it: ${opts.resetLink}`,
    "",
    "If it was not you, ignore this message; nothing about your account has changed.",
  ].join("\n");
  return { to: opts.to, subject: "Your Benchfold account", text };
}

/** Sent instead of a reset link when no active account has the address: the reset answer is the same. */
export function passwordResetNoAccountMail(opts: { to: string; signUpLink: string }): OutgoingMail {
  const text = [
    "Someone asked to reset the password of a Benchfold account with this address, but there is no active Benchfold account with it.",
    "",
    "If you have an account, it may be under another address, or its administrator may have disabled it.",
    `Customers can create an account here: ${opts.signUpLink}`,
    "",
    "If it was not you, ignore this message.",
  ].join("\n");
  return { to: opts.to, subject: "Reset your Benchfold password", text };
}

/**
 * Sent instead of an invitation link when the address has an account in another organization:
 * an address holds one account, and the inviting admin must not learn that this one exists.
 */
export function invitationExistingAccountMail(opts: { to: string; organizationName: string; inviterName: string; role: string }): OutgoingMail {
  const text = [
    `${opts.inviterName} invited you to join ${opts.organizationName} on Benchfold as ${roleWords[opts.role] ?? opts.role}.`,
    "",
    "You already have a Benchfold account with this address, and an address holds one account, so the invitation cannot be accepted with it.",
    `To join ${opts.organizationName}, ask ${opts.inviterName} to invite another address of yours. The invitation was not accepted and nothing about your account has changed.`,
  ].join("\n");
  return { to: opts.to, subject: `Invitation to ${opts.organizationName} on Benchfold`, text };
}
