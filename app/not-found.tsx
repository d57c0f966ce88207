import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <h1>Nothing here</h1>
      <p className="mt-3 text-ink-soft">The page or record does not exist, or is not visible to your role.</p>
      <p className="mt-6"><Link href="/home">Back to your home page</Link></p>
    </main>
  );
}
