import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { orPageError } from "@/lib/http/page-errors";
import { FitWorkbench } from "@/components/library/fit-workbench";
import { requirePageUser } from "@/lib/auth/session";
import { exampleCrossoverCsv } from "@/lib/fitting";
import type { PopulationContent } from "@/lib/library/populations/content";
import { shellSettingsOf } from "@/lib/library/fit-run";
import { getItem } from "@/lib/library/service";
import { fromSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";

export const metadata: Metadata = { title: "Fit from crossovers" };

async function load(id: number) {
  return orPageError(getItem("populations", id));
}

export default async function FitPage({ params }: { params: Promise<{ kind: string; id: string }> }) {
  const { kind, id: idText } = await params;
  if (kind !== "populations" || !/^\d+$/.test(idText)) notFound();
  await requirePageUser("library.edit");
  const item = await load(Number(idText));
  const content = item.current.content as PopulationContent;
  return (
    <div className="space-y-5">
      <p className="text-sm"><Link href={`/library/populations/${item.id}`}>← {item.name}</Link></p>
      <header>
        <h1>Fit membrane parameters: {item.name}</h1>
        <p className="mt-1 max-w-3xl text-ink-soft">Membrane capacitance and conductance from first crossover frequencies measured at several medium conductivities, by non-linear least squares on the full single-shell model (with this population&apos;s cytoplasm and membrane thickness) with 95 % confidence intervals that cover measurement noise only.</p>
      </header>
      {content.spec.membrane ? (
        <FitWorkbench
          id={item.id}
          baseVersion={item.currentVersion}
          name={item.name}
          radiusUm={tidy(fromSI("um", content.spec.radius.mean), 4)}
          currentC={content.spec.membrane.capacitance.mean}
          currentG={content.spec.membrane.conductance.mean}
          exampleCsv={exampleCrossoverCsv()}
          shell={shellSettingsOf(content.spec)}
        />
      ) : (
        <p className="notice">This population uses the {content.spec.model} model, which has no membrane. Change it to a cell model first.</p>
      )}
    </div>
  );
}
