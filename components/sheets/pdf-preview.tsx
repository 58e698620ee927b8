"use client";

import { useEffect, useRef, useState } from "react";
import { ApiError } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";

type PdfState = { phase: "waiting" } | { phase: "rendering"; startedAt: number } | { phase: "ready"; url: string } | { phase: "error"; message: string };

/**
 * The draft PDF, fetched only once the frame scrolls into view (rendering takes several seconds) and again
 * whenever `version` changes after a save. Fetching it ourselves gives a real "rendering" state and errors in words.
 */
export function PdfPreview({ deviceId, version, partNumber }: { deviceId: number; version: number; partNumber: string }) {
  const src = `/api/devices/${deviceId}/sheet/pdf`;
  const boxRef = useRef<HTMLDivElement>(null);
  const [visible, setVisible] = useState(false);
  const [state, setState] = useState<PdfState>({ phase: "waiting" });
  const [now, setNow] = useState(() => Date.now());

  useEffect(() => {
    const box = boxRef.current;
    if (!box || visible) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting)) setVisible(true);
      },
      { rootMargin: "400px 0px" },
    );
    observer.observe(box);
    return () => observer.disconnect();
  }, [visible]);

  useEffect(() => {
    if (!visible) return;
    const controller = new AbortController();
    let objectUrl: string | null = null;
    setState({ phase: "rendering", startedAt: Date.now() });
    (async () => {
      try {
        const response = await fetch(`${src}?v=${version}`, { credentials: "same-origin", cache: "no-store", signal: controller.signal });
        if (!response.ok) {
          const body = (await response.json().catch(() => null)) as { error?: { code?: string; message?: string } } | null;
          throw new ApiError(response.status, body?.error?.code ?? "unknown", body?.error?.message ?? `The server answered ${response.status}.`);
        }
        objectUrl = URL.createObjectURL(await response.blob());
        setState({ phase: "ready", url: objectUrl });
      } catch (error) {
        if (controller.signal.aborted) return;
        setState({ phase: "error", message: error instanceof Error ? error.message : "The PDF could not be rendered." });
      }
    })();
    return () => {
      controller.abort();
      if (objectUrl) URL.revokeObjectURL(objectUrl);
    };
  }, [visible, version, src]);

  useEffect(() => {
    if (state.phase !== "rendering") return;
    const timer = window.setInterval(() => setNow(Date.now()), 1000);
    return () => window.clearInterval(timer);
  }, [state.phase]);

  return (
    <div ref={boxRef} className="flex h-full min-h-[32rem] flex-col" data-testid="pdf-preview" data-phase={state.phase}>
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <p className="running-head">PDF · draft</p>
        <p className="flex gap-3 text-sm">
          <a href={src} target="_blank" rel="noopener">
            Open in a new tab
          </a>
          <a href={`${src}?download=1`} className={buttonClass.quiet}>
            Download
          </a>
        </p>
      </div>
      <div className="relative flex-1 border border-rule bg-paper-deep">
        {state.phase === "ready" ? (
          <iframe src={`${state.url}#navpanes=0&view=FitH`} title={`${partNumber} draft sheet, PDF`} className="absolute inset-0 h-full w-full" />
        ) : (
          <div className="absolute inset-0 flex items-center justify-center p-6 text-center" role="status" aria-live="polite">
            {state.phase === "error" ? (
              <div className="max-w-sm">
                <p className="font-semibold text-signal-deep">The PDF could not be rendered.</p>
                <p className="mt-1 text-sm">{state.message}</p>
                <p className="mt-2 text-sm text-ink-muted">The web sheet beside it is built from the same model.</p>
              </div>
            ) : (
              <div>
                <p className="font-semibold">Rendering PDF…</p>
                <p className="mt-1 text-sm text-ink-muted">
                  {state.phase === "rendering" ? (
                    <>
                      <span className="figure">{Math.max(0, Math.round((now - state.startedAt) / 1000))}</span> s — fonts, charts and pages take a few
                      seconds.
                    </>
                  ) : (
                    "Starts when this frame is on screen."
                  )}
                </p>
              </div>
            )}
          </div>
        )}
      </div>
    </div>
  );
}
