"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

type Item = { href: string; label: string };

export function NavLinks({ items }: { items: Item[] }) {
  const pathname = usePathname();
  return (
    <ul className="-mb-px flex flex-wrap gap-x-7" data-testid="main-navigation">
      {items.map((item) => {
        const current = pathname === item.href || pathname.startsWith(`${item.href}/`);
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={current ? "page" : undefined}
              className={`inline-block border-b-2 pb-2.5 pt-1 text-[0.9375rem] no-underline ${
                current ? "border-signal font-semibold text-ink" : "border-transparent text-ink-muted hover:border-rule-strong hover:text-ink"
              }`}
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
