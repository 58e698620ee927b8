import { chromium } from "@playwright/test";
const [url, ...rest] = process.argv.slice(2);
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium" });
const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
await page.goto("http://localhost:3111" + url, { waitUntil: "networkidle" });
for (let i = 0; i < rest.length; i += 2) {
  const loc = page.locator(rest[i + 1]).first();
  await loc.screenshot({ path: `/tmp/compare-el-${rest[i]}.png` });
}
await browser.close();
