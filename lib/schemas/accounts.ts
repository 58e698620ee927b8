import { z } from "zod";
import { roles } from "@/lib/domain/permissions";
import { newPasswordSchema, refinePasswordAgainstContext } from "./password";

/** Shared by the forms and the route handlers. */
const email = z.string().trim().toLowerCase().email("Enter a valid e-mail address.").max(254);
const password = newPasswordSchema;
const personName = z.string().trim().min(1, "Enter a name.").max(120);

export const signUpBodySchema = z
  .object({
    name: personName,
    email,
    password,
    company: z.string().trim().min(2, "Enter your company or institution.").max(160),
  })
  .superRefine(refinePasswordAgainstContext((v) => [v.name, v.email, v.company]));
export type SignUpBody = z.infer<typeof signUpBodySchema>;

export const inviteUserBodySchema = z.object({ email, role: z.enum(roles) });
export type InviteUserBody = z.infer<typeof inviteUserBodySchema>;

export const updateUserBodySchema = z
  .object({ role: z.enum(roles).optional(), disabled: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, "Send a role, disabled, or both.");
export type UpdateUserBody = z.infer<typeof updateUserBodySchema>;

export const acceptInvitationBodySchema = z
  .object({ token: z.string().min(20).max(200), name: personName, password })
  .superRefine(refinePasswordAgainstContext((v) => [v.name]));
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBodySchema>;

export const requestPasswordResetBodySchema = z.object({ email });
export type RequestPasswordResetBody = z.infer<typeof requestPasswordResetBodySchema>;

export const resetPasswordBodySchema = z.object({ token: z.string().min(20).max(200), password });
export type ResetPasswordBody = z.infer<typeof resetPasswordBodySchema>;

export const confirmSignUpBodySchema = z.object({ token: z.string().min(20).max(200) });
export type ConfirmSignUpBody = z.infer<typeof confirmSignUpBodySchema>;
