import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20" data-testid="forbidden">
      <h1>Not available to your role</h1>
      <p className="mt-3 text-ink-soft">
        This page belongs to another role in the lab&apos;s separation of duties. If you need it, ask your admin to review
        your role.
      </p>
      <p className="mt-6"><Link href="/home">Back to your home page</Link></p>
    </main>
  );
}
