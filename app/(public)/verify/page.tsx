import type { Metadata } from "next";
import { VerifyView } from "@/components/verify/verify-view";

export const metadata: Metadata = {
  title: "Verify a printout",
  description: "Check whether a datasheet PDF is a released Benchfold revision, and whether it is still current.",
};

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/** Public: anyone may verify a printout. `?q=` (a SHA-256 or a reference) is asked at once, so a check can be linked. */
export default async function VerifyPage({ searchParams }: Props) {
  const q = (await searchParams).q;
  return <VerifyView initial={typeof q === "string" ? q.slice(0, 500) : ""} />;
}
