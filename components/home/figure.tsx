import Link from "next/link";

/**
 * One headline count on a home page, linking to the list it counts; the noun agrees with the number
 * ("1 approved version in use", "2 approved versions in use").
 */
export function Figure({ one, many, value, href }: { one: string; many: string; value: number; href: string }) {
  return (
    <Link href={href} className="card block no-underline hover:bg-paper-deep/40" data-testid="home-figure">
      <p className="text-3xl font-semibold text-ink">{value}</p>
      <p className="text-sm text-ink-soft">{value === 1 ? one : many}</p>
    </Link>
  );
}
