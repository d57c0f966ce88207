"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type FieldValues, type Resolver } from "react-hook-form";
import type { z } from "zod";
import { saveLibraryItemAction } from "@/lib/library/actions";
import type { LibraryKind } from "@/lib/library/kinds";
import { applyServerErrors } from "./save-result";
import type { EditingInfo } from "./version-meta-fields";

/**
 * The form of one library item (population, buffer or device): react-hook-form checked with the kind's zod schema
 * (the same the server action parses with), saved through the library's action as a new item or a new version of
 * `editing`, field errors put next to their fields, and on success the item's page. One hook for the three forms.
 * @example const { form, status, submit } = useItemForm("buffers", bufferFormSchema, defaults, editing);
 */
export function useItemForm<V extends FieldValues>(kind: LibraryKind, schema: z.ZodType, defaults: V, editing: EditingInfo | null) {
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const form = useForm<V>({ resolver: zodResolver(schema as never) as unknown as Resolver<V>, defaultValues: defaults as never });
  const submit = form.handleSubmit(async (values) => {
    const result = await saveLibraryItemAction(kind, editing ? { id: editing.id, baseVersion: editing.version } : null, values);
    setStatus({ ok: result.ok, text: applyServerErrors(result, form.setError) });
    if (result.ok && result.data) {
      router.push(`/library/${kind}/${result.data.id}`);
      router.refresh();
    }
  });
  return { form, status, submit };
}
