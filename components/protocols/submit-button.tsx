"use client";

import { useRouter } from "next/navigation";
import { submitVersionAction } from "@/lib/protocols/actions";
import { ActionButton } from "./action-button";

/** The author's "Submit for review" button (sends the lock version the page was rendered with). */
export function SubmitButton({ versionId, lockVersion }: { versionId: number; lockVersion: number }) {
  const router = useRouter();
  return (
    <ActionButton
      label="Submit for review"
      hint="QA reviewers are e-mailed. The content is frozen while it is in review."
      act={() => submitVersionAction({ versionId, lockVersion })}
      onDone={() => router.refresh()}
    />
  );
}
