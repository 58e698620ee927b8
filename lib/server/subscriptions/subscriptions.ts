import "server-only";
import { QueryTypes, UniqueConstraintError } from "sequelize";
import { AppError } from "@/lib/errors";
import { deviceClassLabels, type DeviceClass } from "@/lib/domain/device-classes";
import { datasheetPath } from "@/lib/domain/reviews";
import type { SentNoticeView, SubscriptionsPage, SubscriptionView } from "@/lib/domain/subscriptions";
import type { FollowBody } from "@/lib/schemas/subscriptions";
import { db } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { readUnsubscribeToken } from "./unsubscribe-token";

type Row = {
  id: number;
  device_id: number | null;
  device_class: DeviceClass | null;
  created_at: Date;
  org_name: string;
  org_slug: string;
  part_number: string | null;
  current_letter: string | null;
};

/** "Frequency multipliers of Kestrel Devices": the label of a class subscription. */
export function classFollowLabel(deviceClass: DeviceClass, organizationName: string): string {
  return `Every ${(deviceClassLabels[deviceClass] ?? deviceClass).toLowerCase()} of ${organizationName}`;
}

/** What the customer follows, and the notices queued to their address (newest 50). */
export async function listSubscriptions(viewer: SessionUser): Promise<SubscriptionsPage> {
  authorize(viewer, "subscriptions");
  const { sequelize, OutboxMessage } = db();
  const rows = await sequelize.query<Row>(
    `SELECT s.id, s.device_id, s.device_class, s.created_at, o.name AS org_name, o.slug AS org_slug, d.part_number,
            (SELECT r.letter FROM sheet_revisions r
              WHERE r.device_id = s.device_id
                AND NOT EXISTS (SELECT 1 FROM sheet_revision_withdrawals w WHERE w.revision_id = r.id)
                AND NOT EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = r.id)
              LIMIT 1) AS current_letter
       FROM subscriptions s
       JOIN organizations o ON o.id = s.organization_id
       LEFT JOIN devices d ON d.id = s.device_id
      WHERE s.user_id = :userId
      ORDER BY s.created_at DESC, s.id DESC`,
    { type: QueryTypes.SELECT, replacements: { userId: viewer.id } },
  );
  const follows: SubscriptionView[] = rows.map((r) => ({
    id: r.id,
    kind: r.device_id !== null ? "part" : "device-class",
    organization: { name: r.org_name, slug: r.org_slug },
    partNumber: r.part_number,
    deviceClass: r.device_class,
    label: r.device_id !== null ? `${r.part_number} of ${r.org_name}` : classFollowLabel(r.device_class!, r.org_name),
    publicPath: r.part_number && r.current_letter ? datasheetPath(r.org_slug, r.part_number, "current") : null,
    createdAt: new Date(r.created_at).toISOString(),
  }));
  const messages = await OutboxMessage.findAll({
    where: { recipient: viewer.email.toLowerCase() },
    attributes: ["id", "subject", "createdAt", "sentAt", "attempts"],
    order: [["id", "DESC"]],
    limit: 50,
  });
  const sent: SentNoticeView[] = messages.map((m) => ({ id: m.id, subject: m.subject, queuedAt: m.createdAt.toISOString(), sentAt: m.sentAt ? m.sentAt.toISOString() : null, attempts: m.attempts }));
  return { follows, sent };
}

/**
 * Follows a released part, or an organization's device class. Only what is public can be
 * followed: a part without a released revision, or an unknown organization, is a 404 in the same
 * words as a part that does not exist. Following again what one follows already is no change.
 */
export async function follow(viewer: SessionUser, body: FollowBody): Promise<{ subscription: SubscriptionView; created: boolean }> {
  authorize(viewer, "subscriptions");
  const { sequelize, Organization, Subscription } = db();
  const notFound = () => new AppError("not-found", body.partNumber ? "No released sheet of that part." : "No such organization.");
  const organization = await Organization.findOne({ where: { slug: body.organization }, attributes: ["id", "name", "slug", "kind"] });
  if (!organization || organization.kind === "customer") throw notFound();
  let deviceId: number | null = null;
  if (body.partNumber !== undefined) {
    const [device] = await sequelize.query<{ id: number }>(
      `SELECT d.id FROM devices d WHERE d.organization_id = :org AND d.part_number = :part
          AND EXISTS (SELECT 1 FROM sheet_revisions r WHERE r.device_id = d.id) LIMIT 1`,
      { type: QueryTypes.SELECT, replacements: { org: organization.id, part: body.partNumber } },
    );
    if (!device) throw notFound();
    deviceId = device.id;
  }
  const target = { userId: viewer.id, organizationId: organization.id, deviceId, deviceClass: (body.deviceClass ?? null) as DeviceClass | null };
  const created = await sequelize.transaction(async (transaction) => {
    const existing = await Subscription.findOne({ where: target, transaction });
    if (existing) return null;
    try {
      const row = await Subscription.create(target, { transaction });
      await recordAuditEvent(
        { organizationId: viewer.organizationId, actorUserId: viewer.id, action: "subscription.followed", subjectType: "subscription", subjectId: row.id, before: null, after: { organization: organization.slug, partNumber: body.partNumber ?? null, deviceClass: body.deviceClass ?? null } },
        transaction,
      );
      return row;
    } catch (error) {
      if (error instanceof UniqueConstraintError) return null;
      throw error;
    }
  });
  const { follows } = await listSubscriptions(viewer);
  const view = follows.find((f) => f.organization.slug === organization.slug && (deviceId !== null ? f.partNumber === body.partNumber && f.kind === "part" : f.kind === "device-class" && f.deviceClass === body.deviceClass));
  if (!view) throw new AppError("internal", "The subscription was not found after it was made.");
  return { subscription: view, created: created !== null };
}

/** Stops one of the viewer's own subscriptions (another person's is a 404, in the same words). */
export async function unfollow(viewer: SessionUser, subscriptionId: number): Promise<void> {
  authorize(viewer, "subscriptions");
  await removeSubscription(subscriptionId, viewer.id, viewer.organizationId, "subscription.unfollowed", () => new AppError("not-found", "You do not follow this."));
}

/**
 * The unsubscribe link of a notice, without signing in: the token's signature must be this app's
 * (any altered character is a 422), and then the subscription it names ends. A link used twice
 * answers the same: the notices have stopped.
 */
export async function unsubscribeByToken(token: string): Promise<{ label: string | null; alreadyStopped: boolean }> {
  const claim = readUnsubscribeToken(token.trim());
  if (!claim) throw new AppError("invalid", "This unsubscribe link is not valid: it may have been cut short or changed. Use the link of the latest notice, or sign in and stop the notices on your subscriptions page.", { field: "token" });
  const { User } = db();
  const user = await User.findByPk(claim.userId, { attributes: ["id", "organizationId"] });
  const label = await subscriptionLabel(claim.subscriptionId, claim.userId);
  const removed = user ? await removeSubscription(claim.subscriptionId, claim.userId, user.organizationId, "subscription.unsubscribed-by-link", () => null) : false;
  return { label, alreadyStopped: !removed };
}

/** What a token's subscription is about, for the unsubscribe page; null when it has ended already. */
export async function describeUnsubscribeToken(token: string): Promise<{ valid: boolean; label: string | null }> {
  const claim = readUnsubscribeToken(token.trim());
  if (!claim) return { valid: false, label: null };
  return { valid: true, label: await subscriptionLabel(claim.subscriptionId, claim.userId) };
}

async function subscriptionLabel(subscriptionId: number, userId: number): Promise<string | null> {
  const [row] = await db().sequelize.query<{ device_class: DeviceClass | null; part_number: string | null; org_name: string }>(
    `SELECT s.device_class, d.part_number, o.name AS org_name FROM subscriptions s
       JOIN organizations o ON o.id = s.organization_id LEFT JOIN devices d ON d.id = s.device_id
      WHERE s.id = :id AND s.user_id = :userId`,
    { type: QueryTypes.SELECT, replacements: { id: subscriptionId, userId } },
  );
  if (!row) return null;
  return row.part_number !== null ? `${row.part_number} of ${row.org_name}` : classFollowLabel(row.device_class!, row.org_name);
}

async function removeSubscription(subscriptionId: number, userId: number, actorOrganizationId: number, action: string, missing: () => AppError | null): Promise<boolean> {
  const { sequelize, Subscription } = db();
  return sequelize.transaction(async (transaction) => {
    const row = await Subscription.findOne({ where: { id: subscriptionId, userId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!row) {
      const error = missing();
      if (error) throw error;
      return false;
    }
    await recordAuditEvent(
      { organizationId: actorOrganizationId, actorUserId: userId, action, subjectType: "subscription", subjectId: row.id, before: { organizationId: row.organizationId, deviceId: row.deviceId, deviceClass: row.deviceClass }, after: null },
      transaction,
    );
    await row.destroy({ transaction });
    return true;
  });
}
