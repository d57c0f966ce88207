import type { Knex } from "knex";
import { planWindows } from "../../lib/planner";
import { libraryBufferToStep, type LibraryBufferContent } from "../../lib/wizard/buffer-form";
import { defaultDevice, libraryDeviceToStep, type LibraryDeviceContent } from "../../lib/wizard/device-form";
import { pickableBuffers, pickableDevices, pickablePopulations } from "../../lib/wizard/library-picks";
import { defaultLimits } from "../../lib/wizard/limits-form";
import { specToForm } from "../../lib/wizard/population-form";
import { readyInputs, toWindowsRequest } from "../../lib/wizard/request";
import { saveAsProtocol } from "../../lib/wizard/drafts/save-as-protocol";
import { saveStepInputs, startDraft } from "../../lib/wizard/drafts/service";
import { approveVersion } from "../../lib/protocols/review";
import { newVersion, submitVersion } from "../../lib/protocols/service";
import { recordRun } from "../../lib/runs/service";
import { findActiveUserByEmail } from "../../lib/users/repo";
import { DEMO_PASSWORD } from "./01_users";

/**
 * Demo protocols for the invented scenario, made the way users make them (planner draft → save → submit → sign):
 * Larkspur's yeast viability sort approved with one bench run and a version 2 draft in progress; Quarry Hill's
 * dead-cell removal in review. Runs the real planner, so the saved results are reproducible model output.
 */

type Person = { id: number; email: string; name: string; role: "developer" | "reviewer" | "technician" };

async function person(knex: Knex, email: string): Promise<Person> {
  const user = await findActiveUserByEmail(email, knex);
  if (!user) throw new Error(`Seed 03 needs the demo user ${email} (seed 01)`);
  return { id: user.id, email: user.email, name: user.name, role: user.role as Person["role"] };
}

async function planAndSave(dev: Person, names: { target: string; other: string; buffer: string; device: string }, save: { title: string; purpose: string; notes: string }) {
  const pops = await pickablePopulations();
  const pick = (name: string) => {
    const p = pops.find((x) => x.name === name);
    if (!p) throw new Error(`Seed 03 needs the library population "${name}" (seed 02)`);
    return specToForm(p.name, p.spec, { id: p.id, version: p.version });
  };
  const buffer = (await pickableBuffers()).find((b) => b.name === names.buffer);
  const device = (await pickableDevices()).find((d) => d.name === names.device);
  if (!buffer || !device) throw new Error(`Seed 03 needs the library buffer "${names.buffer}" and device "${names.device}" (seed 02)`);
  const inputs = {
    populations: { target: pick(names.target), other: pick(names.other) },
    buffer: libraryBufferToStep(buffer.content as unknown as LibraryBufferContent, { id: buffer.id, version: buffer.version }),
    device: libraryDeviceToStep(device.content as unknown as LibraryDeviceContent, { id: device.id, version: device.version }, defaultDevice()),
    limits: defaultLimits(),
  };
  const draft = await startDraft(dev, inputs);
  const ready = readyInputs(draft.inputs);
  if (!ready.ok) throw new Error(`Seed 03: the ${ready.step} step is not valid: ${ready.message}`);
  const best = planWindows(toWindowsRequest(ready)).windows[0];
  if (!best) throw new Error(`Seed 03: the planner found no operating window for ${names.target} vs ${names.other}`);
  await saveStepInputs(dev, draft.id, "results", { rank: 1, window: { conductivity: best.conductivity, bandStart: best.bandStart, bandStop: best.bandStop } }, "save");
  return saveAsProtocol(dev, draft.id, { ...save, destination: "new", protocolId: null, washes: 2, resuspensionMillionsPerMl: 5 });
}

async function lockOf(knex: Knex, versionId: number): Promise<number> {
  return Number((await knex("protocol_versions").where({ id: versionId }).first("lock_version")).lock_version);
}

export async function seed(knex: Knex): Promise<void> {
  const dana = await person(knex, "dana.dev@example.test");
  const lee = await person(knex, "lee.dev@example.test");
  const quinn = await person(knex, "quinn.qa@example.test");
  const tomas = await person(knex, "tomas.tech@example.test");

  const yeast = await planAndSave(
    dana,
    { target: "Larkspur viable brewing yeast", other: "Larkspur heat-killed brewing yeast", buffer: "Low-salt sucrose for yeast, 3 mS/m", device: "Interdigitated chip, 40 µm electrodes" },
    { title: "Larkspur viable yeast enrichment", purpose: "Separate viable from heat-killed brewing yeast before the viability count.", notes: "Wash twice in DEP buffer (3 min at 1000 g); resuspend just before loading." },
  );
  await submitVersion(dana, { versionId: yeast.versionId, lockVersion: await lockOf(knex, yeast.versionId) });
  await approveVersion(quinn, { versionId: yeast.versionId, lockVersion: await lockOf(knex, yeast.versionId), meaning: "Approved for bench use", password: DEMO_PASSWORD });

  const v1 = await knex("protocol_versions").where({ id: yeast.versionId }).first("content_json");
  const content = typeof v1.content_json === "string" ? JSON.parse(v1.content_json) : v1.content_json;
  const sel = content.selection;
  await recordRun(tomas, {
    versionId: yeast.versionId,
    bufferLot: "LFQ-BUF-1127",
    conductivityUsPerCm: Number((content.buffer.targetConductivity25 * 1e4 * 1.01).toFixed(2)),
    measuredAtC: 25,
    operatingTemperatureC: sel.temperatureC,
    frequencyHz: sel.frequency,
    osmolalityMOsmPerKg: 296,
    minutesInBuffer: 25,
    voltageVpp: Number(sel.voltageVpp.toFixed(1)),
    flowRateUlPerMin: sel.flowRateUlPerMin ?? undefined,
    recoveryPercent: 84,
    purityPercent: 91,
    countingMethod: "Haemocytometer with methylene blue, 4 squares per fraction",
    deviations: "None.",
    notes: "Demo run (invented values).",
  });
  await newVersion(dana, yeast.protocolId);

  const lymph = await planAndSave(
    lee,
    { target: "Quarry Hill live lymphocytes", other: "Quarry Hill dead lymphocytes", buffer: "Isotonic sucrose–glucose, 10 mS/m", device: "Interdigitated chip, 40 µm electrodes" },
    { title: "Quarry Hill dead-cell removal", purpose: "Remove dead lymphocyte-like cells before expansion.", notes: "Keep cells on ice until loading; at most 30 min in the low-conductivity buffer." },
  );
  await submitVersion(lee, { versionId: lymph.versionId, lockVersion: await lockOf(knex, lymph.versionId) });
}
