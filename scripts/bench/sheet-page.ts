/**
 * The public sheet page in a browser (part of `npm run bench`): Debian's chromium through Playwright,
 * a fresh browser context (empty cache) per load, against a running app (BENCHFOLD_BENCH_URL, default
 * http://localhost:3000, with the demo loaded). Printed, per page:
 *
 *   - first-load JavaScript: every script response the page loads until the network is idle,
 *     each body gzip-compressed here (level 9, as bundle-size reports count it), summed; and the
 *     inline scripts of the HTML (the React Server Components payload), apart;
 *   - Largest Contentful Paint: the last `largest-contentful-paint` entry a PerformanceObserver
 *     (registered before the page's own scripts) saw, median of BENCH_PAGE_LOADS (5) loads.
 *
 * With the time to first byte and first contentful paint (what part of the LCP is the server's).
 * Beside the released sheet (BENCH_SHEET_PATH, default the demo doubler's current revision), the home
 * page as the reference measured in the same run. Targets (figures, not assertions): under 120 kB
 * gzip and under 1 s. Skipped with a note when nothing answers or the sheet is not there.
 */
import { gzipSync } from "node:zlib";
import { chromium, type Browser } from "@playwright/test";

const baseUrl = process.env.BENCHFOLD_BENCH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
const sheetPath = process.env.BENCH_SHEET_PATH ?? "/datasheets/kestrine/KDX-2G4/current";
const loads = Number(process.env.BENCH_PAGE_LOADS ?? 5);

type PageLoad = { scripts: { url: string; bytes: number; gzip: number }[]; inlineGzip: number; htmlGzip: number; lcpMs: number | null; lcpElement: string | null; ttfbMs: number; fcpMs: number | null; status: number };

const kb = (bytes: number) => (bytes / 1024).toFixed(1);

async function loadOnce(browser: Browser, path: string): Promise<PageLoad> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  await context.addInitScript(() => {
    const w = window as unknown as { __lcp: { t: number; el: string } | null };
    w.__lcp = null;
    new PerformanceObserver((list) => {
      const last = list.getEntries().at(-1) as (PerformanceEntry & { element?: Element | null }) | undefined;
      if (last) w.__lcp = { t: last.startTime, el: last.element ? `${last.element.tagName.toLowerCase()}${last.element.id ? `#${last.element.id}` : ""}` : "" };
    }).observe({ type: "largest-contentful-paint", buffered: true });
  });
  const page = await context.newPage();
  const pending: Promise<{ url: string; bytes: number; gzip: number } | null>[] = [];
  page.on("response", (response) => {
    if (response.request().resourceType() !== "script") return;
    pending.push(
      response
        .body()
        .then((body) => ({ url: response.url(), bytes: body.length, gzip: gzipSync(body, { level: 9 }).length }))
        .catch(() => null),
    );
  });
  const response = await page.goto(`${baseUrl}${path}`, { waitUntil: "networkidle" });
  const html = (await response?.text()) ?? "";
  // LCP is final once the page is interacted with or hidden; a short settle lets the last candidate land.
  await page.waitForTimeout(500);
  const lcp = await page.evaluate(() => (window as unknown as { __lcp: { t: number; el: string } | null }).__lcp);
  const timing = await page.evaluate(() => ({
    ttfb: (performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming).responseStart,
    fcp: performance.getEntriesByName("first-contentful-paint")[0]?.startTime ?? null,
  }));
  const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]).join("");
  const scripts = (await Promise.all(pending)).filter((s): s is { url: string; bytes: number; gzip: number } => s !== null);
  await context.close();
  return {
    scripts,
    inlineGzip: gzipSync(Buffer.from(inline), { level: 9 }).length,
    htmlGzip: gzipSync(Buffer.from(html), { level: 9 }).length,
    lcpMs: lcp?.t ?? null,
    lcpElement: lcp?.el ?? null,
    ttfbMs: timing.ttfb,
    fcpMs: timing.fcp,
    status: response?.status() ?? 0,
  };
}

async function measure(browser: Browser, name: string, path: string): Promise<void> {
  const runs: PageLoad[] = [];
  for (let i = 0; i < loads; i++) runs.push(await loadOnce(browser, path));
  const first = runs[0];
  if (first.status !== 200) {
    console.log(`${name} (${path}): answered ${first.status}; skipped`);
    return;
  }
  const gzip = first.scripts.reduce((sum, s) => sum + s.gzip, 0);
  const raw = first.scripts.reduce((sum, s) => sum + s.bytes, 0);
  const lcps = runs.map((r) => r.lcpMs).filter((t): t is number => t !== null).sort((a, b) => a - b);
  const median = lcps.length ? lcps[Math.floor(lcps.length / 2)] : null;
  const mid = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  const ttfb = mid(runs.map((r) => r.ttfbMs));
  const fcp = mid(runs.map((r) => r.fcpMs ?? Number.NaN).filter((t) => !Number.isNaN(t)));
  console.log(
    `${name.padEnd(28)} JS ${kb(gzip).padStart(6)} kB gzip (${kb(raw)} kB, ${first.scripts.length} scripts; inline RSC payload ${kb(first.inlineGzip)} kB gzip)   ` +
      `LCP median ${median === null ? "n/a" : `${median.toFixed(0)} ms`} of ${lcps.length} (${lcps.map((t) => t.toFixed(0)).join(", ")}), element ${first.lcpElement ?? "n/a"}; ` +
      `median time to first byte ${ttfb.toFixed(0)} ms, first contentful paint ${fcp === undefined ? "n/a" : `${fcp.toFixed(0)} ms`}; HTML ${kb(first.htmlGzip)} kB gzip`,
  );
  if (process.env.BENCH_PAGE_LIST_SCRIPTS) {
    for (const s of [...first.scripts].sort((a, b) => b.gzip - a.gzip)) console.log(`    ${kb(s.gzip).padStart(6)} kB  ${new URL(s.url).pathname}`);
  }
}

async function main() {
  try {
    await fetch(`${baseUrl}/api/health/live`);
  } catch {
    console.log(`sheet page benchmark skipped: nothing answers at ${baseUrl} (start the app with npm start, or set BENCHFOLD_BENCH_URL)`);
    return;
  }
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--disable-background-networking", "--disable-component-update", "--no-first-run"],
  });
  try {
    console.log(`\nPublic pages in chromium (fresh context per load, ${loads} loads each), against ${baseUrl}; targets: JS < 120 kB gzip, LCP < 1000 ms`);
    await measure(browser, "released sheet", sheetPath);
    await measure(browser, "home page (reference)", "/");
  } finally {
    await browser.close();
  }
}

main().catch((error) => {
  console.error(`sheet page benchmark failed: ${(error as Error).message}`);
  process.exit(1);
});
