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
