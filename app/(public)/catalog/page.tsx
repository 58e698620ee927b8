import type { Metadata } from "next";
import { CatalogView } from "@/components/catalog/catalog-view";
import { parseCatalogQuery, emptyCatalogQuery } from "@/lib/catalog/catalog-query";
import { searchCatalog } from "@/lib/server/catalog/search-catalog";

export const metadata: Metadata = {
  title: "Catalog",
  description: "Released RF datasheets of every organization on Benchfold, searchable by class, frequency and guaranteed limits.",
};

type SearchParams = Record<string, string | string[] | undefined>;

export default async function CatalogPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const params = await searchParams;
  const parsed = parseCatalogQuery(params);
  const query = parsed.ok ? parsed.query : emptyCatalogQuery;
  // A query that cannot be read is said at the top with the field it names; nothing is searched.
  const result = parsed.ok ? await searchCatalog(query) : null;
  const first = (name: string) => {
    const v = params[name];
    return (Array.isArray(v) ? v[0] : v) ?? "";
  };
  const all = (name: string) => {
    const v = params[name];
    return v === undefined ? [] : Array.isArray(v) ? v : [v];
  };
  // What was typed goes back into the form, cut short so ten thousand characters are not echoed.
  const clip = (s: string) => s.slice(0, 200);
  return (
    <CatalogView
      query={query}
      typed={{ q: clip(first("q")), class: clip(first("class")), org: clip(first("org")), covers: clip(first("covers")), f: all("f").slice(0, 8).map(clip) }}
      result={result}
      issues={parsed.ok ? [] : parsed.issues}
    />
  );
}
