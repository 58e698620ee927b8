import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { datasheetPath } from "@/lib/domain/reviews";
import type { DeviceClass } from "@/lib/domain/device-classes";
import { db } from "@/models";
import { serverConfig } from "../config";
import { enqueueNotices, type Notice } from "../outbox/enqueue-notices";
import { classFollowLabel } from "./subscriptions";
import { makeUnsubscribeToken } from "./unsubscribe-token";

export type FollowerEvent = { event: "released"; revisionId: number } | { event: "withdrawn"; revisionId: number; reason: string; withdrawnAt: Date };

/** At most this many lines of what changed in a notice; the rest is on the sheet's page. */
export const noticeChangeLines = 8;

type Follower = { subscription_id: number; user_id: number; email: string; device_id: number | null };

/**
 * One notice per follower of a part (its device) or of its organization's device class, queued in
 * the event's own transaction: a release says what changed (the revision's notes, which the
 * review's diff generated) and links both revisions; a withdrawal gives the reason and the
 * revision current now. Each mail carries its follower's own signed unsubscribe link, in the text
 * and as List-Unsubscribe with one-click POST (RFC 2369, RFC 8058). A person who follows both
 * the part and its class gets one mail, whose link stops the part.
 */
export async function queueFollowerNotices(e: FollowerEvent, transaction: Transaction): Promise<number> {
  const { sequelize } = db();
  const [revision] = await sequelize.query<{
    id: number; letter: string; organization_id: number; device_id: number; release_notes: string | string[]; released_at: Date;
    part_number: string; title: string; device_class: DeviceClass; org_name: string; slug: string; previous_letter: string | null;
  }>(
    `SELECT r.id, r.letter, r.organization_id, r.device_id, r.release_notes, r.released_at, d.part_number, d.title, d.device_class,
            o.name AS org_name, o.slug, p.letter AS previous_letter
       FROM sheet_revisions r
       JOIN devices d ON d.id = r.device_id
       JOIN organizations o ON o.id = r.organization_id
       LEFT JOIN sheet_revisions p ON p.id = r.previous_revision_id
      WHERE r.id = :id`,
    { type: QueryTypes.SELECT, transaction, replacements: { id: e.revisionId } },
  );
  if (!revision) throw new Error(`revision ${e.revisionId} not found for its notices`);
  const followers = await sequelize.query<Follower>(
    `SELECT s.id AS subscription_id, s.user_id, u.email, s.device_id
       FROM subscriptions s
       JOIN users u ON u.id = s.user_id AND u.disabled_at IS NULL
      WHERE s.device_id = :deviceId OR (s.organization_id = :organizationId AND s.device_class = :deviceClass)
      ORDER BY s.device_id IS NULL, s.id`,
    { type: QueryTypes.SELECT, transaction, replacements: { deviceId: revision.device_id, organizationId: revision.organization_id, deviceClass: revision.device_class } },
  );
  const seen = new Set<number>();
  const once = followers.filter((f) => !seen.has(f.user_id) && seen.add(f.user_id));
  if (once.length === 0) return 0;

  const url = (letter: string) => `${serverConfig.appUrl}${datasheetPath(revision.slug, revision.part_number, letter)}`;
  const part = `${revision.part_number} (${revision.title})`;
  let subject: string;
  let body: string[];
  if (e.event === "released") {
    const notes = typeof revision.release_notes === "string" ? (JSON.parse(revision.release_notes) as string[]) : revision.release_notes;
    const shown = notes.slice(0, noticeChangeLines);
    subject = `${revision.part_number} revision ${revision.letter} released`;
    body = [
      `${revision.org_name} released revision ${revision.letter} of the datasheet of ${part} on ${revision.released_at.toISOString().slice(0, 10)}.`,
      "",
      revision.previous_letter ? `What changed since revision ${revision.previous_letter}:` : "What it says:",
      ...shown.map((line) => `  - ${line}`),
      ...(notes.length > shown.length ? [`  … and ${notes.length - shown.length} more, listed on the sheet.`] : []),
      "",
      `Revision ${revision.letter}: ${url(revision.letter)}`,
      ...(revision.previous_letter ? [`Revision ${revision.previous_letter}: ${url(revision.previous_letter)}`] : []),
    ];
  } else {
    const [current] = await sequelize.query<{ letter: string }>(
      `SELECT r.letter FROM sheet_revisions r
        WHERE r.device_id = :deviceId AND r.id <> :id
          AND NOT EXISTS (SELECT 1 FROM sheet_revision_withdrawals w WHERE w.revision_id = r.id)
          AND NOT EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = r.id)
        LIMIT 1`,
      { type: QueryTypes.SELECT, transaction, replacements: { deviceId: revision.device_id, id: revision.id } },
    );
    subject = `${revision.part_number} revision ${revision.letter} withdrawn`;
    body = [
      `${revision.org_name} withdrew revision ${revision.letter} of the datasheet of ${part} on ${e.withdrawnAt.toISOString().slice(0, 10)}.`,
      "",
      "Reason:",
      ...e.reason.split(/\r?\n/).map((line) => `  ${line}`),
      "",
      `Revision ${revision.letter} (withdrawn): ${url(revision.letter)}`,
      current ? `Revision ${current.letter} (current): ${url(current.letter)}` : "No revision of this part is current now.",
    ];
  }
  const notices: Notice[] = once.map((f) => {
    const token = makeUnsubscribeToken({ subscriptionId: f.subscription_id, userId: f.user_id });
    const why = f.device_id !== null ? `you follow ${revision.part_number} of ${revision.org_name}` : `you follow ${classFollowLabel(revision.device_class, revision.org_name).replace(/^E/, "e")}`;
    return {
      organizationId: revision.organization_id,
      eventKey: `sheet-revision:${revision.id}:${e.event}:follower`,
      to: f.email,
      subject,
      text: [...body, "", "—", `You receive this because ${why} on Benchfold.`, `Stop these notices (no sign-in needed): ${serverConfig.appUrl}/unsubscribe/${token}`].join("\n"),
      headers: {
        "List-Unsubscribe": `<${serverConfig.appUrl}/api/unsubscribe?token=${encodeURIComponent(token)}>`,
        "List-Unsubscribe-Post": "List-Unsubscribe=One-Click",
      },
    };
  });
  await enqueueNotices(transaction, notices);
  return notices.length;
}
