import { NextResponse, type NextRequest } from "next/server";

/**
 * A Content-Security-Policy with a fresh nonce for every page request (the Next.js guide
 * "How to set a Content Security Policy": the proxy puts the policy on the request, Next.js
 * reads the nonce from it while rendering and stamps it on its own scripts, and the same
 * policy goes out on the response). Nonces only reach dynamically rendered pages: the root
 * layout calls connection() so that every page is one.
 *
 * The headers every response carries (nosniff, Referrer-Policy, X-Frame-Options) are set in
 * next.config.mjs, which also reaches route handlers and static files; this file only adds
 * what needs the nonce. It is not a security boundary: sessions and permissions are checked
 * in every page and route handler.
 */
export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
  const policy = contentSecurityPolicy(nonce, process.env.NODE_ENV === "development");

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("content-security-policy", policy);

  const response = isPrebuiltErrorPage(request.nextUrl.pathname)
    ? NextResponse.rewrite(new URL("/_not-a-page", request.url), { request: { headers: requestHeaders } })
    : NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return response;
}

/**
 * Next builds its global error page at build time as `/_global-error`, so that HTML carries no
 * nonce. When a page fails (the root layout cannot reach the database, say), Next draws the global
 * error within that page's own request, with this request's nonce on every script (checked with
 * MariaDB stopped: 500, the nonce on all scripts, no CSP report). Only a request for the address
 * itself got the prebuilt HTML, whose scripts this policy refuses; it is not a page anyone is sent
 * to, so it answers as an address with no page (404, rendered per request).
 */
function isPrebuiltErrorPage(pathname: string): boolean {
  return pathname === "/_global-error" || pathname.startsWith("/_global-error/") || pathname.startsWith("/_global-error.");
}

function contentSecurityPolicy(nonce: string, development: boolean): string {
  return [
    "default-src 'self'",
    // Next's inline bootstrap scripts carry the nonce; 'strict-dynamic' lets them load the
    // chunks they need (react-vega's, lazily). No 'unsafe-eval': charts evaluate Vega
    // expressions with vega-interpreter (components/charts/curve-chart.tsx). React's dev
    // build needs eval for its error overlays, so `next dev` gets it and nothing else does.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    // Styles stay 'unsafe-inline' (and without a nonce, which would switch 'unsafe-inline'
    // off): a nonce cannot cover style="" attributes, which Vega writes into every chart's SVG
    // (server-drawn and in the browser); vega-embed and vega-tooltip insert <style> elements
    // without one; and a <style> React inserts on a client-side navigation would carry the
    // nonce of that RSC request, not the one this document's policy names. Injected CSS
    // cannot run script, and prose is sanitised before it is drawn.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    // The sheet workspace shows the draft PDF in a frame from a blob: URL it fetched itself.
    "frame-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

export const config = {
  matcher: [
    // Pages only: route handlers (api) answer JSON or PDF, never a document that runs script,
    // and static files have nothing to nonce. RSC prefetches render no HTML (the guide's advice).
    {
      source: "/((?!api/|_next/static/|_next/image|favicon.ico).*)",
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
