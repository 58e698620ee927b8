import { chromium } from "@playwright/test";
import { gzipSync } from "node:zlib";
const base = process.env.BASE ?? "http://localhost:3111";
const shots = JSON.parse(process.argv[2]);
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium" });
const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
for (const [name, url, full] of shots) {
  const scripts = new Map();
  page.on("response", async (r) => {
    if (r.request().resourceType() === "script") {
      try { scripts.set(r.url(), (await r.body()).length ? gzipSync(await r.body()).length : 0); } catch {}
    }
  });
  const res = await page.goto(base + url, { waitUntil: "networkidle" });
  await page.screenshot({ path: `/tmp/compare-${name}.png`, fullPage: !!full });
  const total = [...scripts.values()].reduce((a, b) => a + b, 0);
  console.log(name, res.status(), "scripts", scripts.size, "gzip kB", (total / 1024).toFixed(1));
  page.removeAllListeners("response");
}
await browser.close();
