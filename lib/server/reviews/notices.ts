import "server-only";
import { Op, type Transaction } from "sequelize";
import { db } from "@/models";
import type { SheetCandidate } from "@/models";
import { serverConfig } from "../config";
import { enqueueNotices } from "../outbox/enqueue-notices";
import { organizationMembers } from "../outbox/organization-members";
import { queueFollowerNotices } from "../subscriptions/follower-notices";

export type CandidateEvent =
  | { event: "submitted"; candidate: SheetCandidate }
  | { event: "changes-requested"; candidate: SheetCandidate; reason: string }
  | { event: "signed"; candidate: SheetCandidate; signerName: string; approved: boolean }
  | { event: "stale"; candidate: SheetCandidate; reason: string }
  | { event: "released"; candidate: SheetCandidate; letter: string; revisionId: number };

/**
 * The notices an event of the review sends, queued in the event's own transaction (the outbox):
 * submission → the organization's reviewers; changes requested and approval → the submitter;
 * a stale candidate → the submitter and every reviewer who commented or signed (or all reviewers
 * when none did); a release → the organization's engineers and reviewers, and every customer who
 * follows the part or its organization's device class (queueFollowerNotices: one mail each, with
 * what changed and a signed unsubscribe link). Each event names itself, so no one gets the same
 * notice twice.
 */
export async function queueCandidateNotice(e: CandidateEvent, transaction: Transaction): Promise<void> {
  const { Device } = db();
  const c = e.candidate;
  const device = await Device.findByPk(c.deviceId, { attributes: ["id", "partNumber"], transaction });
  const part = device?.partNumber ?? `device #${c.deviceId}`;
  const reviewLink = `${serverConfig.appUrl}/review/sheets/${c.id}`;
  const sheetLink = `${serverConfig.appUrl}/sheets/${c.deviceId}`;
  const submitter = await emailsOf([c.submittedById], transaction);
  // The organization's reviewers other than the submitter (four eyes: they never review their own).
  const otherReviewers = async () => (await organizationMembers(c.organizationId, ["reviewer"], transaction)).filter((to) => !submitter.includes(to));
  let recipients: string[];
  let subject: string;
  let text: string[];
  switch (e.event) {
    case "submitted":
      recipients = await otherReviewers();
      subject = `Sheet ${part} submitted for review`;
      text = [`The sheet of ${part} was submitted for review (candidate #${c.id}).`, "", `Review it: ${reviewLink}`];
      break;
    case "changes-requested":
      recipients = submitter;
      subject = `Changes requested on sheet ${part}`;
      text = [`A reviewer asked for changes to the sheet of ${part} (candidate #${c.id}):`, "", e.reason, "", `Open the sheet: ${sheetLink}`];
      break;
    case "signed":
      recipients = submitter;
      subject = e.approved ? `Sheet ${part} approved for release` : `Sheet ${part} signed by ${e.signerName}`;
      text = e.approved
        ? [`${e.signerName} signed the sheet of ${part} (candidate #${c.id}); it is approved and may be released.`, "", `Release it: ${sheetLink}`]
        : [`${e.signerName} signed the sheet of ${part} (candidate #${c.id}); it needs another reviewer's signature before release.`, "", reviewLink];
      break;
    case "stale": {
      const actors = await reviewActors(c, transaction);
      recipients = [...submitter, ...(actors.length ? await emailsOf(actors, transaction) : await otherReviewers())];
      subject = `Review of sheet ${part} starts over`;
      text = [`Candidate #${c.id} of the sheet of ${part} is out of date.`, "", e.reason, "", `Open the sheet: ${sheetLink}`];
      break;
    }
    case "released":
      recipients = await organizationMembers(c.organizationId, ["engineer", "reviewer"], transaction);
      subject = `Sheet ${part} released as revision ${e.letter}`;
      text = [`Revision ${e.letter} of the sheet of ${part} is released.`, "", `Open the sheet: ${sheetLink}`];
      await queueFollowerNotices({ event: "released", revisionId: e.revisionId }, transaction);
      break;
  }
  const eventKey = `sheet-candidate:${c.id}:${e.event}${e.event === "signed" ? `:${e.signerName}` : ""}`;
  await enqueueNotices(
    transaction,
    [...new Set(recipients)].map((to) => ({ organizationId: c.organizationId, eventKey, to, subject, text: text.join("\n") })),
  );
}

async function emailsOf(userIds: number[], transaction: Transaction): Promise<string[]> {
  const { User } = db();
  const users = await User.findAll({ where: { id: { [Op.in]: userIds }, disabledAt: null }, attributes: ["email"], order: [["id", "ASC"]], transaction });
  return users.map((u) => u.email);
}

/** The people other than the submitter who commented on or signed the candidate. */
async function reviewActors(candidate: SheetCandidate, transaction: Transaction): Promise<number[]> {
  const { SheetComment, SheetSignature } = db();
  const [comments, signatures] = await Promise.all([
    SheetComment.findAll({ where: { candidateId: candidate.id }, attributes: ["authorId"], transaction }),
    SheetSignature.findAll({ where: { candidateId: candidate.id }, attributes: ["signerId"], transaction }),
  ]);
  return [...new Set([...comments.map((x) => x.authorId), ...signatures.map((x) => x.signerId)])].filter((id) => id !== candidate.submittedById);
}
