/**
 * Change notices: what a customer follows, and what the subscriptions page shows. Pure types and
 * words, shared by the page, the follow button and the API.
 */
import type { DeviceClass } from "./device-classes";

/** A part (one device's released sheets) or an organization's device class (every part of it, present and future). */
export const followKinds = ["part", "device-class"] as const;
export type FollowKind = (typeof followKinds)[number];

export type SubscriptionView = {
  id: number;
  kind: FollowKind;
  organization: { name: string; slug: string };
  /** For a part. */
  partNumber: string | null;
  /** For a device class. */
  deviceClass: DeviceClass | null;
  /** "KDX-2G4" or "Frequency multipliers of Kestrel Devices". */
  label: string;
  /** The part's current revision, when it has one. */
  publicPath: string | null;
  createdAt: string;
};

/** A notice queued to the customer's address (outbox), newest first. */
export type SentNoticeView = { id: number; subject: string; queuedAt: string; sentAt: string | null; attempts: number };

export type SubscriptionsPage = { follows: SubscriptionView[]; sent: SentNoticeView[] };
