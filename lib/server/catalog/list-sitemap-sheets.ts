import "server-only";
import { datasheetPath, type RevisionStanding } from "@/lib/domain/reviews";
import { publicSelect } from "../db/public-reads";

/** One released sheet's public address for the sitemap. */
export interface SitemapSheet {
  /** The lettered address: what the page's canonical link names (the "current" address points there too). */
  path: string;
  standing: Exclude<RevisionStanding, "withdrawn">;
  /** When the page last changed: the latest release or withdrawal of its part (each shows in every revision's history). */
  changedAt: Date;
}

/** A sitemap file holds at most 50,000 addresses (sitemaps.org protocol). */
export const SITEMAP_LIMIT = 50_000;

/**
 * The released revisions search engines may list, by their canonical (lettered) address: every
 * revision of every organization that is not withdrawn, current ones first. Public, like the pages
 * (resource `released-sheets`): only released revisions exist in these tables. A withdrawn revision
 * stays readable at its address but is not offered for indexing.
 */
export async function listSitemapSheets(): Promise<SitemapSheet[]> {
  const rows = await publicSelect<{ slug: string; part_number: string; letter: string; superseded: number; changed_at: Date | string }>(
    `SELECT o.slug, d.part_number, r.letter,
            EXISTS (SELECT 1 FROM sheet_revisions n WHERE n.previous_revision_id = r.id) AS superseded,
            (SELECT GREATEST(MAX(r2.released_at), COALESCE(MAX(w2.withdrawn_at), MAX(r2.released_at)))
               FROM sheet_revisions r2 LEFT JOIN sheet_revision_withdrawals w2 ON w2.revision_id = r2.id
              WHERE r2.device_id = r.device_id) AS changed_at
       FROM sheet_revisions r
       JOIN devices d ON d.id = r.device_id
       JOIN organizations o ON o.id = d.organization_id
      WHERE NOT EXISTS (SELECT 1 FROM sheet_revision_withdrawals w WHERE w.revision_id = r.id)
      ORDER BY superseded, o.slug, d.part_number, r.sequence DESC
      LIMIT ${SITEMAP_LIMIT}`,
  );
  return rows.map((row) => ({
    path: datasheetPath(row.slug, row.part_number, row.letter),
    standing: Number(row.superseded) ? "superseded" : "current",
    changedAt: new Date(row.changed_at),
  }));
}
