"use client";

import { FaultPage } from "@/components/layout/fault-page";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return <FaultPage error={error} reset={reset} />;
}
