/** The Sievewright mark: a sieve of three bars with two paths leaving it in opposite directions. */
export function Wordmark({ size = 28 }: { size?: number }) {
  return (
    <span className="inline-flex items-center gap-2 font-semibold tracking-tight text-ink">
      <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
        <rect x="2" y="2" width="28" height="28" rx="7" fill="#3f6b58" />
        <path d="M9 10h14M9 16h14M9 22h14" stroke="#f6f4ef" strokeWidth="2" strokeLinecap="round" />
        <circle cx="12" cy="13" r="2" fill="#f5e1d6" />
        <circle cx="20" cy="19" r="2" fill="#dfe6f4" />
      </svg>
      <span style={{ fontSize: size * 0.64 }}>Sievewright</span>
    </span>
  );
}
