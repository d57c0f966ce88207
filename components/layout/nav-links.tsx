"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** Navigation links with the current section marked (aria-current). */
export function NavLinks({ items }: { items: { href: string; label: string }[] }) {
  const pathname = usePathname();
  return (
    <ul className="space-y-0.5">
      {items.map((item) => {
        const section = item.href.split("/").slice(0, 2).join("/");
        const active = pathname === item.href || pathname.startsWith(section + "/") || pathname === section;
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={active ? "page" : undefined}
              className={`block rounded-md px-2.5 py-1.5 text-sm no-underline ${
                active ? "bg-white font-medium text-ink shadow-sm ring-1 ring-paper-line" : "text-ink-soft hover:bg-white/70"
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
