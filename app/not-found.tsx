import Link from "next/link";

export default function NotFound() {
  return (
    <section className="max-w-prose" aria-labelledby="not-found-title">
      <p className="running-head mb-2">
        <span className="figure text-signal-deep">404</span> · Not found
      </p>
      <h1 id="not-found-title" className="text-[2rem] font-semibold leading-tight">
        There is no page at this address
      </h1>
      <p className="mt-4 text-[1.0625rem] text-ink-muted">
        The link may be mistyped, or it may point at something that was never released. Released sheets are listed in the{" "}
        <Link href="/catalog">catalog</Link>.
      </p>
    </section>
  );
}
