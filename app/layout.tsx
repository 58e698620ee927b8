import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { connection } from "next/server";
import { SiteFooter } from "@/components/site-footer";
import { SiteHeader } from "@/components/site-header";
import { tokens } from "@/lib/design/tokens";
import { getSessionUser } from "@/lib/server/auth/session";
import "./globals.css";

// Full TTFs from the installed packages: nothing is fetched at build or run time.
const textFont = localFont({
  src: [
    { path: "../node_modules/@expo-google-fonts/source-sans-3/400Regular/SourceSans3_400Regular.ttf", weight: "400", style: "normal" },
    { path: "../node_modules/@expo-google-fonts/source-sans-3/400Regular_Italic/SourceSans3_400Regular_Italic.ttf", weight: "400", style: "italic" },
    { path: "../node_modules/@expo-google-fonts/source-sans-3/600SemiBold/SourceSans3_600SemiBold.ttf", weight: "600", style: "normal" },
    { path: "../node_modules/@expo-google-fonts/source-sans-3/700Bold/SourceSans3_700Bold.ttf", weight: "700", style: "normal" },
  ],
  variable: "--font-text",
  display: "swap",
  fallback: ["system-ui", "sans-serif"],
});

const figureFont = localFont({
  src: [
    { path: "../node_modules/@expo-google-fonts/source-code-pro/400Regular/SourceCodePro_400Regular.ttf", weight: "400", style: "normal" },
    { path: "../node_modules/@expo-google-fonts/source-code-pro/600SemiBold/SourceCodePro_600SemiBold.ttf", weight: "600", style: "normal" },
  ],
  variable: "--font-figures",
  display: "swap",
  fallback: ["ui-monospace", "monospace"],
});

export const metadata: Metadata = {
  title: { default: "Benchfold — characterization datasheets", template: "%s · Benchfold" },
  description:
    "From bench measurements of mixers, frequency multipliers and hybrids to reviewed, released datasheets your customers can trust.",
};

export const viewport: Viewport = { themeColor: tokens.colors.paper };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request, so Next can stamp the request's CSP nonce (proxy.ts) on
  // its scripts; a page prerendered at build time would ship scripts the policy blocks. (The
  // session read makes pages dynamic too; this keeps it so if that ever moves.)
  await connection();
  const user = await getSessionUser();
  return (
    <html lang="en" className={`${textFont.variable} ${figureFont.variable}`}>
      <body className="flex min-h-dvh flex-col bg-paper text-ink antialiased">
        <a href="#content" className="skip-link">
          Skip to content
        </a>
        <SiteHeader user={user} />
        <main id="content" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-5 pb-20 pt-10 outline-none sm:px-8">
          {children}
        </main>
        <SiteFooter />
      </body>
    </html>
  );
}
