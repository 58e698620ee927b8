const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  // Stricter than the browsers' default (strict-origin-when-cross-origin): another site learns
  // nothing, not even which instance a reader came from (sheet prose may link out). Same-origin
  // requests keep the full Referer and, unlike no-referrer, a real Origin on form posts, which
  // the route guard's origin check needs.
  { key: "Referrer-Policy", value: "same-origin" },
  // For browsers without CSP frame-ancestors, and for responses the proxy does not reach.
  { key: "X-Frame-Options", value: "DENY" },
];

// Route handlers answer JSON, PDF or next-auth's few plain HTML pages, never a document of ours
// that runs script: their policy allows nothing to load (OWASP REST Security Cheat Sheet,
// "Security headers": default-src 'none'; frame-ancestors 'none'), bar the inline <style> of
// next-auth's sign-out page and its form posting back here. proxy.ts (pages, with a nonce) does
// not reach /api, and neither does an /api address with no handler (Next's 404 page), which this
// policy covers too: its text shows, its scripts do not run. A PDF gets the same: Chromium 156
// still draws it in its own viewer under this policy (checked in a real window under Xvfb;
// older Chromium refused object-src 'none' there, crbug.com/271452).
const routeHandlerPolicy = "default-src 'none'; style-src 'unsafe-inline'; form-action 'self'; base-uri 'none'; frame-ancestors 'none'";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Native addons and packages that load optional drivers at run time stay outside the bundle.
  serverExternalPackages: [
    "sequelize",
    "mariadb",
    "@aws-sdk/client-s3",
    "@resvg/resvg-js",
    "vega",
    "vega-lite",
    "bcryptjs",
    "nodemailer",
    "mailparser",
  ],
  // Inlined at build time; only `npm test` sets it, to offer the test-only device classes (lib/domain/device-classes.ts).
  env: { BENCHFOLD_TEST_DEVICE_CLASSES: process.env.BENCHFOLD_TEST_DEVICE_CLASSES ?? "" },
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  // forbidden() from next/navigation: a page refused to a signed-in role answers HTTP 403 (app/forbidden.tsx).
  experimental: { authInterrupts: true },
  // On every response, pages, route handlers and static files alike; route handlers also get
  // their policy. The per-request Content-Security-Policy (with its nonce) is added to pages by proxy.ts.
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: routeHandlerPolicy }] },
    ];
  },
};

export default nextConfig;
