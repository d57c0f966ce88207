"use client";

import "./globals.css";
import { FaultPage } from "@/components/layout/fault-page";

export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body className="min-h-screen font-sans">
        <FaultPage error={error} reset={reset} />
      </body>
    </html>
  );
}
