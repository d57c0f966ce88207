import type { Metadata } from "next";
import { DeviceStep } from "@/components/planner/device-step";
import { StepHeader } from "@/components/planner/step-header";
import { defaultDevice, type DeviceStepValues } from "@/lib/wizard/device-form";
import { pickableDevices } from "@/lib/wizard/library-picks";
import { loadStep } from "@/lib/wizard/drafts/page-data";

export const metadata: Metadata = { title: "Planner · Device and drive" };

export default async function DevicePage({ params }: { params: Promise<{ draftId: string }> }) {
  const { draft, done } = await loadStep(params);
  const library = (await pickableDevices()).map((d) => ({ id: d.id, version: d.version, name: d.name, content: d.content }));
  const initial = { ...defaultDevice(), ...((draft.inputs.device as Partial<DeviceStepValues> | undefined) ?? {}) };
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="device" done={done}>
        The electrodes set how strong the field gradient is per volt; the generator limit and the speed you need set the voltage; the
        voltage sets the heating. Give the geometry, or paste Γ from your own field simulation and say where it came from.
      </StepHeader>
      <DeviceStep draftId={draft.id} initial={initial} library={library} />
    </>
  );
}
