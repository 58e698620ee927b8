"use client";

import Link from "next/link";
import { useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";

/**
 * The page a notice's "Stop these notices" link opens: it says what will stop and asks for one
 * click (a link-checking mail scanner that only opens links stops nothing), then posts the token.
 */
export function UnsubscribeView({ token, valid, label }: { token: string; valid: boolean; label: string | null }) {
  const [state, setState] = useState<"ready" | "busy" | "done" | { error: string }>("ready");
  const header = <PageHeader runningHead="Change notices" title="Stop notices" />;
  if (!valid) {
    return (
      <>
        {header}
        <Notice tone="error">This unsubscribe link is not valid: it may have been cut short or changed. Use the link of the latest notice, or <Link href="/subscriptions">sign in and stop the notices on your subscriptions page</Link>.</Notice>
      </>
    );
  }
  if (state === "done" || label === null) {
    return (
      <>
        {header}
        <Notice tone="success">{label ? `You will get no more notices about ${label}.` : "These notices are stopped already; you will get no more of them."}</Notice>
      </>
    );
  }
  async function stop() {
    setState("busy");
    try {
      await requestJson("/api/unsubscribe", { method: "POST", body: { token } });
      setState("done");
    } catch (e) {
      setState({ error: messageOf(e) });
    }
  }
  return (
    <>
      {header}
      <p className="mb-4 text-[1.0625rem]">Stop the e-mails about {label}?</p>
      <button type="button" className={buttonClass.primary} disabled={state === "busy"} onClick={() => void stop()}>
        Stop these notices
      </button>
      {typeof state === "object" ? <div className="mt-4"><Notice tone="error">{state.error}</Notice></div> : null}
    </>
  );
}
