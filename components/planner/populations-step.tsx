"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { populationFormSchema, populationsStepSchema, type PopulationsStepOutput, type PopulationsStepValues } from "@/lib/wizard/population-form";
import type { StartingPoint } from "@/lib/wizard/starting-points";
import { PopulationCard, type LibraryPopulation } from "./population-card";
import { SpectrumPreview, type PreviewInput } from "./spectrum-preview";
import { StepFooter } from "./step-footer";
import { useAutosave } from "./use-autosave";

/** Step 1: the target population and the one to remove, with a live Re[K] preview of both. */
export function PopulationsStep({ draftId, initial, library, starts, medium, mediumNote, canSaveToLibrary }: {
  draftId: number;
  initial: PopulationsStepValues;
  library: LibraryPopulation[];
  starts: StartingPoint[];
  medium: PreviewInput["medium"];
  mediumNote: string;
  /** The viewer may write the population library (capability library.edit). */
  canSaveToLibrary: boolean;
}) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, formState: { errors, isSubmitting } } = useForm<PopulationsStepValues, unknown, PopulationsStepOutput>({
    resolver: zodResolver(populationsStepSchema),
    defaultValues: initial,
    mode: "onChange",
  });
  const values = useWatch({ control }) as PopulationsStepValues;
  const { state, saveNow } = useAutosave(draftId, "populations", values);
  const json = JSON.stringify(values);
  const preview = useMemo<PreviewInput>(() => {
    const v = JSON.parse(json) as PopulationsStepValues;
    const side = (x: unknown) => {
      const r = populationFormSchema.safeParse(x);
      return r.success ? { name: r.data.name, spec: r.data.spec } : null;
    };
    return { target: side(v.target), other: side(v.other), medium };
  }, [json, medium]);

  async function onValid(out: PopulationsStepOutput) {
    setFormError(null);
    if (await saveNow("buffer", `${out.target.name} vs ${out.other.name}`)) router.push(`/planner/${draftId}/buffer`);
  }

  return (
    <form onSubmit={handleSubmit(onValid, () => setFormError("Some fields need attention; each says what is allowed."))} noValidate className="space-y-6">
      <SpectrumPreview input={preview} mediumNote={mediumNote} />
      <div className="grid gap-6 xl:grid-cols-2">
        <PopulationCard which="target" heading="Target population (to keep)" values={values.target} register={register} setValue={setValue} errors={errors} library={library} starts={starts} canSaveToLibrary={canSaveToLibrary} />
        <PopulationCard which="other" heading="Population to remove" values={values.other} register={register} setValue={setValue} errors={errors} library={library} starts={starts} canSaveToLibrary={canSaveToLibrary} />
      </div>
      <StepFooter backHref="/planner" nextLabel="Next: buffer" state={state} busy={isSubmitting} formError={formError} />
    </form>
  );
}
