import type { Metadata } from "next";
import { BufferStep } from "@/components/planner/buffer-step";
import { StepHeader } from "@/components/planner/step-header";
import { defaultBuffer, type BufferStepValues } from "@/lib/wizard/buffer-form";
import { pickableBuffers } from "@/lib/wizard/library-picks";
import { loadStep } from "@/lib/wizard/drafts/page-data";

export const metadata: Metadata = { title: "Planner · Buffer" };

export default async function BufferPage({ params }: { params: Promise<{ draftId: string }> }) {
  const { draft, done } = await loadStep(params);
  const library = (await pickableBuffers()).map((b) => ({ id: b.id, version: b.version, name: b.name, content: b.content }));
  const initial = { ...defaultBuffer(), ...((draft.inputs.buffer as Partial<BufferStepValues> | undefined) ?? {}) };
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="buffer" done={done}>
        The medium the cells are suspended in. Its conductivity decides where the crossovers fall; its osmolality decides whether the
        cells survive the sort. Give a recipe, a meter reading, or a range for the planner to search.
      </StepHeader>
      <BufferStep draftId={draft.id} initial={initial} library={library} />
    </>
  );
}
