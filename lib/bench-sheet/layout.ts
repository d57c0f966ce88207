import { ROLE_LABELS, isRole } from "@/lib/auth/roles";
import {
  ACCEPTANCE_TABLE_TEMPERATURES,
  CAUTIONS,
  NOT_FOR_BENCH_MARK,
  RECORD_LINES,
  SECTION_ORDER,
  SECTION_TITLES,
  type SectionId,
} from "@/templates/bench-sheet/layout";
import { osmolalityBandFor } from "@/lib/planner/constraints";
import { acceptanceRange25, readingRangeAt, READING_TEMPERATURE_LIMITS } from "./acceptance";
import { formatUtcMinute } from "@/lib/format/time";
import {
  formatCellDensity,
  formatFrequency,
  frequencyUnitFor,
  formatGrams,
  formatMeterConductivity,
  formatMillilitres,
  formatOsmolality,
  formatPercent,
  formatPercentFixed,
  formatPlain,
  formatSI,
  formatTemperature,
  formatVpp,
  formatVrms,
} from "@/lib/units/format";
import { toSI } from "@/lib/units/lab";
import { flowText, heatingText } from "./flow";
import { scaleRecipe } from "./recipe";
import { isBenchReady, STATE_LABELS } from "@/lib/protocols/states";
import { type BenchSheetLayout, type BenchSheetOptions, type BenchSheetSource, type SheetBlock, type SheetSection } from "./types";

function roleWord(role: string): string {
  return isRole(role) ? ROLE_LABELS[role] : role;
}

function statusSection(source: BenchSheetSource, options: BenchSheetOptions, ready: boolean): SheetBlock[] {
  const { version, signatures } = source;
  const state = STATE_LABELS[version.state];
  const blocks: SheetBlock[] = [];
  if (!ready) {
    const mismatch = (source.integrityProblems ?? []).length > 0 || (version.state === "approved" && signatures.some((s) => s.contentHash !== version.contentHash));
    const why = mismatch
      ? "Its content does not match the content hash that was signed: do not use it, and tell QA."
      : version.state === "superseded" || version.state === "retired"
        ? `It is ${state.toLowerCase()}: a newer version or a decision by QA has replaced it.`
        : `It is ${state.toLowerCase()} and has not been signed for bench use.`;
    blocks.push({ kind: "paragraph", style: "strong", text: `${NOT_FOR_BENCH_MARK}. ${why} This copy is for review only.` });
  }
  blocks.push({
    kind: "fields",
    rows: [
      { label: "State", value: ready ? `${state}, current: signed for bench use` : state },
      { label: "Signatures", value: signatures.length === 0 ? "none" : signatures.map((s) => `${s.signerName}, ${s.meaning}, ${formatUtcMinute(s.signedAt)}`).join("; ") },
      options.issued
        ? { label: "Issued", value: `stored copy of the version approved ${formatUtcMinute(options.printedAt)} (every download is this same file), buffer volume ${options.volumeMl} mL` }
        : { label: "Printed", value: `${formatUtcMinute(options.printedAt)}${options.printedBy ? ` by ${options.printedBy}` : ""}, buffer volume ${options.volumeMl} mL` },
    ],
  });
  return blocks;
}

function bufferSection(source: BenchSheetSource, options: BenchSheetOptions): SheetBlock[] {
  const { buffer } = source.content;
  if (!buffer.recipe) {
    return [
      { kind: "paragraph", text: "This version gives no recipe: prepare the buffer by your laboratory's method, then check its conductivity against the acceptance range in section 2." },
    ];
  }
  const recipe = buffer.recipe;
  const scaled = scaleRecipe(recipe, options.volumeMl);
  const vol = `${options.volumeMl} mL`;
  const rows: string[][] = [];
  const sugar = (percentWV: number) => `${formatPlain(percentWV, 4)} % w/v = ${formatPlain(percentWV * 10, 4)} g/L`;
  if (recipe.sucrosePercentWV > 0) rows.push(["Sucrose (solid)", sugar(recipe.sucrosePercentWV), formatGrams(scaled.sucroseG)]);
  if (recipe.glucosePercentWV > 0) rows.push(["Glucose (solid)", sugar(recipe.glucosePercentWV), formatGrams(scaled.glucoseG)]);
  recipe.additions.forEach((addition, i) => {
    const item = scaled.items[i];
    rows.push([
      `${item.label} (${item.kind === "solid" ? "solid" : "stock solution"})`,
      `${formatPlain(addition.perLitre, 4)} ${item.kind === "solid" ? "g/L" : "mL/L"}`,
      item.kind === "solid" ? formatGrams(item.amount) : formatMillilitres(item.amount),
    ]);
  });
  rows.push(["Deionised water", "to 1000 mL", `to ${vol} final volume`]);
  return [
    { kind: "fields", rows: [{ label: "Buffer", value: buffer.name ?? "DEP buffer (sugar base)" }, { label: "Final volume", value: vol }] },
    { kind: "table", columns: [{ title: "Ingredient", width: 0.42 }, { title: "Per litre", width: 0.3 }, { title: `For ${vol}`, width: 0.28 }], rows },
    {
      kind: "steps",
      items: [
        `Dissolve the sugars in about ${Math.round(options.volumeMl * 0.8)} mL of deionised water.`,
        "Add each solid and stock listed above; mix until clear.",
        `Make up to ${vol} with deionised water and mix again.`,
        "Measure conductivity and its temperature; check them against section 2 before use.",
      ],
    },
    {
      kind: "paragraph",
      style: "note",
      text: `Predicted for this recipe (model): ${formatMeterConductivity(recipe.conductivity25, { withSI: true })} at 25 °C, ${formatOsmolality(toSI("mOsm_kg", recipe.osmolality))}.`,
    },
  ];
}

/**
 * The hand-filled run-record lines, the frequency blank in the unit the settings section prints the frequency in (the
 * web run form asks in the same unit).
 * @example recordLines(1.2e6).find((l) => l.label === "Frequency set")?.unit // "MHz"
 */
export function recordLines(frequencyHz: number): { label: string; unit?: string; lines?: number }[] {
  return RECORD_LINES.map((l) => (l.label === "Frequency set" ? { ...l, unit: frequencyUnitFor(frequencyHz, 4) } : l));
}

/**
 * What osmolality to accept for the sheet's populations and why: the band of cells without a wall (270–330 mOsm/kg)
 * unless both populations have a wall (yeast and the like: anything up to 1000 mOsm/kg), from lib/planner.
 * @example osmolalityAcceptance(yeastPair) // "accept up to 1000 mOsm/kg (both populations are walled cells …)"
 */
export function osmolalityAcceptance(populations: BenchSheetSource["content"]["populations"]): string {
  const band = osmolalityBandFor([populations.target.spec.model, populations.other.spec.model]);
  const max = formatOsmolality(band.max, 4);
  return band.cells === "walled"
    ? `accept up to ${max} (both populations are walled cells, e.g. yeast: the wall holds them in hypotonic media; common practice, value from memory)`
    : `accept ${formatOsmolality(band.min).replace(" mOsm/kg", "")}–${max} (usual band for cells without a wall, such as mammalian cells; common practice)`;
}

function acceptanceSection(source: BenchSheetSource): SheetBlock[] {
  const { buffer, selection } = source.content;
  const target = buffer.targetConductivity25;
  const tol = buffer.tolerance;
  const r25 = acceptanceRange25(target, tol);
  const temps = [...ACCEPTANCE_TABLE_TEMPERATURES] as number[];
  const op = selection.temperatureC;
  if (!temps.includes(op) && op >= READING_TEMPERATURE_LIMITS.min && op <= READING_TEMPERATURE_LIMITS.max) temps.push(op);
  temps.sort((a, b) => a - b);
  const rows = temps.map((t) => {
    const r = readingRangeAt(target, tol, t);
    return [formatTemperature(t) + (t === op ? " (operating)" : ""), formatMeterConductivity(r.low), formatMeterConductivity(r.high)];
  });
  const osmolality = buffer.osmolality ?? buffer.recipe?.osmolality ?? null;
  const accept = osmolalityAcceptance(source.content.populations);
  return [
    {
      kind: "fields",
      rows: [
        { label: "Target at 25 °C", value: `${formatMeterConductivity(target, { withSI: true })} ± ${formatPercent(tol, 2)}` },
        { label: "Accept at 25 °C", value: `${formatMeterConductivity(r25.low)} to ${formatMeterConductivity(r25.high)}` },
        {
          label: "Osmolality",
          value: osmolality === null
            ? `not stated in this version; if measured, ${accept}`
            : `${formatOsmolality(toSI("mOsm_kg", osmolality))} planned; if measured, ${accept}`,
        },
      ],
    },
    {
      kind: "paragraph",
      style: "formula",
      text: "Temperature compensation (linear, 2 %/K, common practice for dilute salts):  σ(t) = σ₂₅ · (1 + 0.02 · (t − 25 °C)).  A reading σ(t) taken at t °C compensates to σ₂₅ = σ(t) / (1 + 0.02 · (t − 25 °C)).",
    },
    {
      kind: "table",
      caption: "Readings to accept on a meter that does not compensate, by the temperature of the buffer when measured:",
      columns: [{ title: "Buffer temperature", width: 0.4 }, { title: "Accept from", width: 0.3 }, { title: "to", width: 0.3 }],
      rows,
    },
    {
      kind: "paragraph",
      text: "A meter set to compensate to 25 °C at 2 %/K: compare its reading with the 25 °C range directly. Outside the range: do not use the buffer; adjust with stock or make a new batch, and note it in the run record.",
    },
  ];
}

function cellsSection(source: BenchSheetSource): SheetBlock[] {
  const { cellPrep, buffer, populations, inputMix } = source.content;
  const steps = [
    cellPrep.washes > 0
      ? `Wash the cells ${cellPrep.washes} time${cellPrep.washes === 1 ? "" : "s"} in the buffer of section 1: pellet gently, remove the supernatant, resuspend in fresh buffer.`
      : "No wash is specified: transfer the cells into the buffer of section 1 as your method prescribes.",
    `Resuspend at ${formatCellDensity(cellPrep.resuspensionCellsPerMl)}; count before loading.`,
    `Start a timer when the cells first meet the low-conductivity buffer. Use them within ${buffer.maxMinutesInBuffer} minutes; after that, discard them and prepare fresh cells.`,
  ];
  const blocks: SheetBlock[] = [
    {
      kind: "fields",
      rows: [
        { label: "Sample", value: `${populations.target.name} (target) with ${populations.other.name}` },
        { label: "Planned input mix", value: `${formatPercentFixed(inputMix.targetFraction)} target cells` },
      ],
    },
    { kind: "steps", items: steps },
  ];
  if (cellPrep.notes.trim()) blocks.push({ kind: "paragraph", style: "note", text: `Protocol notes: ${cellPrep.notes.trim()}` });
  return blocks;
}

function settingsSection(source: BenchSheetSource): SheetBlock[] {
  const { selection, device, sortDesign } = source.content;
  return [
    {
      kind: "fields",
      rows: [
        { label: "Frequency", value: `${formatFrequency(selection.frequency, 4)} (operating window ${formatFrequency(selection.band.low, 4)} to ${formatFrequency(selection.band.high, 4)})` },
        { label: "Amplitude", value: `${formatVpp(selection.voltageVpp)} = ${formatVrms(selection.voltageVrms)}` },
        { label: "Waveform", value: selection.waveform === "sine" ? "Sine" : selection.waveform },
        { label: "Flow rate", value: flowText(selection.flowRateUlPerMin, source.content.plan.result) },
        { label: "Operating temperature", value: formatTemperature(selection.temperatureC) },
        { label: "Medium conductivity", value: `${formatMeterConductivity(selection.conductivity, { withSI: true })} as planned` },
        { label: "Device", value: `${device.name ?? device.geometry} (${device.geometry}); never exceed ${formatVpp(device.maxVoltageVpp)}` },
        { label: "Sort design", value: sortDesign },
        { label: "Predicted heating", value: heatingText(selection.predicted.deltaT, selection.rank, source.content.plan.result) },
      ],
    },
  ];
}

function populationsSection(source: BenchSheetSource): SheetBlock[] {
  const { selection, populations, inputMix, plan } = source.content;
  return [
    {
      kind: "table",
      columns: [{ title: "Population", width: 0.26 }, { title: "Role", width: 0.16 }, { title: "Re[K]", width: 0.12 }, { title: "Expected behaviour", width: 0.46 }],
      rows: [
        [populations.target.name, "target", formatPlain(selection.reK.target, 2), selection.behaviour.target],
        [populations.other.name, "other", formatPlain(selection.reK.other, 2), selection.behaviour.other],
      ],
    },
    {
      kind: "paragraph",
      style: "note",
      text: `Model prediction (engine ${plan.engineVersion}, seed ${plan.seed}) for an input mix of ${formatPercentFixed(inputMix.targetFraction)} target cells: recovery ${formatPercentFixed(selection.predicted.recovery)}, purity ${formatPercentFixed(selection.predicted.purity)}. Verify on the bench and record what you observe.`,
    },
  ];
}

function warningsSection(source: BenchSheetSource): SheetBlock[] {
  const warnings = source.content.selection.warnings;
  if (warnings.length === 0) return [{ kind: "paragraph", text: "The planner raised no warnings at this operating point." }];
  return [
    {
      kind: "bullets",
      items: warnings.map((w) => {
        const amount = (v: number) => formatSI(v, w.unit);
        const limit = w.limit === null || w.limit === undefined ? "" : `; limit ${amount(w.limit)}`;
        const value = w.value === null || w.value === undefined ? "" : ` (${amount(w.value)}${limit})`;
        return `${w.severity.toUpperCase()}: ${w.message}${value}${w.advice ? ` ${w.advice}` : ""}`;
      }),
    },
  ];
}

function footer(source: BenchSheetSource): BenchSheetLayout["footer"] {
  const signatureLines = source.signatures.length === 0
    ? ["Not signed: this version carries no signature."]
    : source.signatures.map((s) => `Signed by ${s.signerName} (${roleWord(s.signerRole)}), "${s.meaning}", ${formatUtcMinute(s.signedAt)}${s.contentHash === source.version.contentHash ? "" : " (signed a different content hash)"}`);
  return { signatureLines, hashLine: `Content SHA-256 ${source.version.contentHash}` };
}

/**
 * Builds the bench sheet as data (sections and blocks in print order) from a version and the printer's choices.
 * Pure: no I/O. Throws InputError for a buffer volume outside 1–5000 mL.
 * @example buildBenchSheet(source, { volumeMl: 250, paper: "a4", printedAt: new Date() }).sections[1].id // "buffer"
 */
export function buildBenchSheet(source: BenchSheetSource, options: BenchSheetOptions): BenchSheetLayout {
  const ready = isBenchReady(source.version, source.signatures, source.integrityProblems);
  const { protocol, version, content } = source;
  const builders: Record<SectionId, () => SheetBlock[]> = {
    status: () => statusSection(source, options, ready),
    buffer: () => bufferSection(source, options),
    acceptance: () => acceptanceSection(source),
    cells: () => cellsSection(source),
    settings: () => settingsSection(source),
    populations: () => populationsSection(source),
    warnings: () => warningsSection(source),
    record: () => [{ kind: "record", lines: recordLines(content.selection.frequency) }],
    cautions: () => [{ kind: "bullets", items: CAUTIONS }],
  };
  const sections: SheetSection[] = SECTION_ORDER.map((id) => ({ id, title: SECTION_TITLES[id], blocks: builders[id]() }));
  const stateLabel = STATE_LABELS[version.state];
  return {
    paper: options.paper,
    header: {
      code: protocol.code,
      title: protocol.title,
      purpose: protocol.purpose,
      versionLabel: `Version ${version.number}`,
      stateLabel,
      runningHeader: `${protocol.code} · ${protocol.title} · version ${version.number} · ${stateLabel}`,
      meta: `Engine ${version.engineVersion} · seed ${content.plan.seed}`,
    },
    mark: ready ? null : NOT_FOR_BENCH_MARK,
    sections,
    footer: footer(source),
  };
}
