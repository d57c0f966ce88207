"use client";

import type { FormOf } from "@/lib/library/form-defaults";
import type { LibraryKind } from "@/lib/library/kinds";
import { BufferForm } from "./buffer-form";
import { DeviceForm } from "./device-form";
import { PopulationForm } from "./population-form";
import type { EditingInfo } from "./version-meta-fields";

/** The form of a library kind. */
export function ItemForm({ kind, defaults, editing }: { kind: LibraryKind; defaults: FormOf[LibraryKind]; editing: EditingInfo | null }) {
  if (kind === "populations") return <PopulationForm defaults={defaults as FormOf["populations"]} editing={editing} />;
  if (kind === "buffers") return <BufferForm defaults={defaults as FormOf["buffers"]} editing={editing} />;
  return <DeviceForm defaults={defaults as FormOf["devices"]} editing={editing} />;
}
