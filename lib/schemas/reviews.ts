import { z } from "zod";
import { commentAnchorKinds, signatureMeanings } from "@/lib/domain/reviews";

const reason = (what: string) => z.string().trim().min(10, `${what} (at least 10 characters).`).max(2000, `${what}: at most 2000 characters.`);

/** Submitting a draft: every open issue the sheet lists acknowledged with a reason, and an optional note to the reviewer. */
export const submitCandidateBodySchema = z.object({
  acknowledgements: z
    .array(z.object({ issue: z.string().min(1).max(2000), reason: reason("Say why this issue may stand") }))
    .max(200)
    .default([]),
  note: z.string().trim().max(4000).default(""),
});
export type SubmitCandidateBody = z.infer<typeof submitCandidateBodySchema>;

/** The reviewer's decision: changes requested (with a reason), or approval signed with the password. */
export const candidateDecisionBodySchema = z.discriminatedUnion("decision", [
  z.object({ decision: z.literal("request-changes"), reason: reason("Say what must change") }),
  z.object({
    decision: z.literal("approve"),
    meaning: z.enum(signatureMeanings, { message: "State the meaning of the signature." }),
    password: z.string().min(1, "Enter your password to sign.").max(200),
  }),
]);
export type CandidateDecisionBody = z.infer<typeof candidateDecisionBodySchema>;

export const commentBodySchema = z
  .object({
    anchor: z.object({ kind: z.enum(commentAnchorKinds), id: z.string().trim().min(1).max(200).optional() }),
    body: z.string().trim().min(1, "Write the comment.").max(4000, "A comment is at most 4000 characters."),
    parentId: z.number().int().positive().optional(),
  })
  .refine((c) => c.anchor.kind === "sheet" || c.anchor.id !== undefined, { message: "Name the row, chart or section the comment is about.", path: ["anchor", "id"] });
export type CommentBody = z.infer<typeof commentBodySchema>;

export const releaseBodySchema = z.object({ note: z.string().trim().max(4000).default("") });
export type ReleaseBody = z.infer<typeof releaseBodySchema>;

export const withdrawBodySchema = z.object({ reason: reason("Say why the revision is withdrawn") });
export type WithdrawBody = z.infer<typeof withdrawBodySchema>;

/** Closing a conformity alert: an engineer says why the sheet may stand (or what will change). */
export const closeConformityAlertBodySchema = z.object({ reason: reason("Say why the alert is closed") });
export type CloseConformityAlertBody = z.infer<typeof closeConformityAlertBodySchema>;
