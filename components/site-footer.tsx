import Link from "next/link";

export function SiteFooter() {
  return (
    <footer data-site className="border-t border-rule">
      <div className="mx-auto flex w-full max-w-page flex-wrap items-baseline justify-between gap-3 px-5 py-6 text-sm text-ink-muted sm:px-8">
        <p>Benchfold — bench data in, signed datasheets out. Limits apply only under the stated conditions.</p>
        <p className="flex gap-4">
          <Link href="/catalog">Released sheets</Link>
          <Link href="/verify">Verify a printout</Link>
        </p>
      </div>
    </footer>
  );
}
