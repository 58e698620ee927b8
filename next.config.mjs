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
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  // forbidden() from next/navigation: a page refused to a signed-in role answers HTTP 403 (app/forbidden.tsx).
  experimental: { authInterrupts: true },
};

export default nextConfig;
