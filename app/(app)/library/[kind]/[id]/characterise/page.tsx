import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { orPageError } from "@/lib/http/page-errors";
import { CharacteriseWorkbench } from "@/components/characterisation/workbench";
import { requirePageUser } from "@/lib/auth/session";
import { characterisationPageData } from "@/lib/characterisation/page-data";

export const metadata: Metadata = { title: "Characterise from measurements" };

export default async function CharacterisePage({ params }: { params: Promise<{ kind: string; id: string }> }) {
  const { kind, id: idText } = await params;
  if (kind !== "populations" || !/^\d+$/.test(idText)) notFound();
  await requirePageUser("library.edit");
  const data = await orPageError(characterisationPageData(Number(idText)));
  return (
    <div className="space-y-5">
      <p className="text-sm"><Link href={`/library/populations/${data.id}`}>← {data.name}</Link></p>
      <header>
        <h1>Characterise from measurements: {data.name}</h1>
        <p className="mt-1 max-w-3xl text-ink-soft">
          Shell parameters of single cells from their DEP velocities in a constant-gradient chamber, their rotation rates in a rotating field, or Re[K]/Im[K] spectra; then the population&apos;s
          spread (mean, CV and distribution of each parameter and of the radius) from the cells you keep. Work with cells only as your institution&apos;s biosafety rules allow, and with electrode
          voltages near liquids only under your local electrical-safety rules.
        </p>
      </header>
      {data.problem ? (
        <p className="notice">{data.problem}</p>
      ) : (
        <CharacteriseWorkbench id={data.id} baseVersion={data.baseVersion} name={data.name} particle={data.particle!} devices={data.devices} examples={data.examples} defaults={data.defaults} />
      )}
    </div>
  );
}
