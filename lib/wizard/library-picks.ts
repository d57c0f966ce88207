import { listPickable } from "@/lib/library/service";
import type { BufferContent } from "@/lib/library/buffers/content";
import type { DeviceContent } from "@/lib/library/devices/content";
import type { PopulationSpec } from "@/lib/populations/spec";

/** A library item the planner can pick (current version), reduced to what the wizard copies. */
export interface Pick<C> {
  id: number;
  version: number;
  name: string;
  category: string | null;
  content: C;
}

/**
 * Current, non-archived populations of the library for the step-1 picker.
 * @example (await pickablePopulations())[0].spec.model
 */
export async function pickablePopulations(): Promise<{ id: number; version: number; name: string; category: string | null; spec: PopulationSpec }[]> {
  const items = await listPickable("populations");
  return items.map((i) => ({ id: i.id, version: i.version, name: i.name, category: i.category, spec: i.content.spec }));
}

/** Current buffers of the library for the step-2 picker. */
export async function pickableBuffers(): Promise<Pick<BufferContent>[]> {
  return (await listPickable("buffers")).map((i) => ({ id: i.id, version: i.version, name: i.name, category: i.category, content: i.content }));
}

/** Current device profiles of the library for the step-3 picker. */
export async function pickableDevices(): Promise<Pick<DeviceContent>[]> {
  return (await listPickable("devices")).map((i) => ({ id: i.id, version: i.version, name: i.name, category: i.category, content: i.content }));
}
