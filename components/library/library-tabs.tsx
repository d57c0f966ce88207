"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

const TABS = [
  { href: "/library/populations", label: "Populations" },
  { href: "/library/buffers", label: "Buffers" },
  { href: "/library/devices", label: "Devices" },
];

/** Sub-navigation between the three libraries. */
export function LibraryTabs() {
  const pathname = usePathname();
  return (
    <nav aria-label="Libraries" className="mb-5 flex gap-1 border-b border-paper-line">
      {TABS.map((t) => {
        const active = pathname === t.href || pathname.startsWith(t.href + "/");
        return (
          <Link
            key={t.href}
            href={t.href}
            aria-current={active ? "page" : undefined}
            className={`-mb-px rounded-t-md border px-4 py-2 text-sm no-underline ${active ? "border-paper-line border-b-white bg-white font-medium text-ink" : "border-transparent text-ink-soft hover:bg-white/60"}`}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
