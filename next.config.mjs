/** @type {import('next').NextConfig} */
const nextConfig = {
  // Native addons and packages that load optional drivers at run time stay outside the bundle.
  serverExternalPackages: [
    "sequelize",
    "mariadb",
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
};

export default nextConfig;
