"use client";

import { useState } from "react";
import { ApiError, messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { deviceClassLabels, type DeviceClass } from "@/lib/domain/device-classes";
import type { SubscriptionView } from "@/lib/domain/subscriptions";

type Props = {
  organizationSlug: string;
  organizationName: string;
  partNumber: string;
  deviceClass: DeviceClass;
  /**
   * What the page knows of the viewer: "customer" shows the buttons, "signed-out" a sign-in link
   * (back to this page), anything else nothing (only customers follow parts).
   */
  viewer: "customer" | "signed-out" | "other";
  /** The page's own path, for the sign-in link's return. */
  returnPath: string;
};

/**
 * "Follow this part" and "Follow every <class> of <organization>" on a released sheet: posts to
 * /api/subscriptions and says in words what now happens. Pages pass what they know of the viewer;
 * the API checks again.
 */
export function FollowButton({ organizationSlug, organizationName, partNumber, deviceClass, viewer, returnPath }: Props) {
  const [done, setDone] = useState<Record<"part" | "class", boolean>>({ part: false, class: false });
  const [error, setError] = useState<string | null>(null);
  const classWords = `every ${deviceClassLabels[deviceClass].toLowerCase()} of ${organizationName}`;
  if (viewer === "other") return null;
  if (viewer === "signed-out") {
    return (
      <p className="text-[0.9375rem]" data-testid="follow-sign-in">
        <a href={`/sign-in?next=${encodeURIComponent(returnPath)}`}>Sign in as a customer</a> to follow this part and get an e-mail when its sheet changes.
      </p>
    );
  }

  async function follow(which: "part" | "class") {
    setError(null);
    try {
      await requestJson<{ subscription: SubscriptionView }>("/api/subscriptions", {
        method: "POST",
        body: which === "part" ? { organization: organizationSlug, partNumber } : { organization: organizationSlug, deviceClass },
      });
      setDone((d) => ({ ...d, [which]: true }));
    } catch (e) {
      setError(e instanceof ApiError && e.status === 401 ? "Your session has ended. Sign in again to follow." : messageOf(e));
    }
  }

  return (
    <div className="space-y-2" data-testid="follow">
      <div className="flex flex-wrap gap-3">
        <button type="button" className={buttonClass.secondary} disabled={done.part} onClick={() => void follow("part")}>
          {done.part ? "✓ Following this part" : "Follow this part"}
        </button>
        <button type="button" className={buttonClass.quiet} disabled={done.class} onClick={() => void follow("class")}>
          {done.class ? `✓ Following ${classWords}` : `Follow ${classWords}`}
        </button>
      </div>
      {done.part || done.class ? (
        <p role="status" className="text-sm text-ink-muted">
          You will get an e-mail when a revision is released or withdrawn. <a href="/subscriptions">Your change notices</a>
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-signal-deep">
          {error}
        </p>
      ) : null}
    </div>
  );
}
