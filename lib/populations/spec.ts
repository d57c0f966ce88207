import { z } from "zod";
import { describeValue, quantity } from "@/lib/dielectric";
import { formatIn } from "@/lib/units/lab";
import { siRangeText } from "@/lib/units/quantity-field";
import { CV_RANGE, DISTRIBUTIONS, POPULATION_FIELDS, setValueAt, SHELL_MODELS, type Distribution, type PopulationField, type ShellModel } from "./fields";

/**
 * A population of cells or beads in SI units (m, S/m, F/m², S/m², S, relative permittivity): a shell model whose
 * parameters each have a mean and a spread. This ONE schema, derived from the field table (./fields.ts), checks the
 * population library, the planner request, the protocol content and the public API.
 */

export { DISTRIBUTIONS, SHELL_MODELS, type Distribution, type ShellModel } from "./fields";

/** A parameter with its natural spread: mean (SI), coefficient of variation (0 = none, 0.1 = 10 %), distribution. */
export interface SpreadParam {
  mean: number;
  cv: number;
  distribution: Distribution;
}

/** A thin layer given by its specific capacitance and conductance. */
interface ThinLayer {
  thickness: number;
  capacitance: SpreadParam;
  conductance: SpreadParam;
}

/** A bulk material. */
interface Body {
  permittivity: SpreadParam;
  conductivity: SpreadParam;
}

/** The population's dielectric model with spreads (SI). Which optional parts are required depends on `model`. */
export interface PopulationSpec {
  model: ShellModel;
  radius: SpreadParam;
  /** Interior: cytoplasm, or the bead's bulk. */
  interior: Body;
  /** Bead surface conductance Ks in S (homogeneous model only). */
  surfaceConductance?: number;
  membrane?: ThinLayer;
  wall?: { thickness: SpreadParam; permittivity: SpreadParam; conductivity: SpreadParam };
  nucleus?: { radiusFraction: SpreadParam; envelope: ThinLayer; nucleoplasm: Body };
}

/** A spec as a request may give it (the distribution may be left out: normal). */
export type PopulationSpecInput = DeepOptionalDistribution<PopulationSpec>;
type DeepOptionalDistribution<T> = T extends SpreadParam
  ? Omit<SpreadParam, "distribution"> & { distribution?: Distribution }
  : T extends object
    ? { [K in keyof T]: DeepOptionalDistribution<T[K]> }
    : T;

function leafSchema(f: PopulationField) {
  const unit = f.si || "relative";
  const mean = quantity({ what: `${f.label}${f.spread ? " mean" : ""} (${unit})`, range: siRangeText(f), min: f.min, max: f.max });
  if (!f.spread) return f.optional ? mean.optional() : mean;
  return z.object(
    {
      mean,
      cv: quantity({ what: `${f.label} coefficient of variation`, range: `between ${CV_RANGE.min} and ${CV_RANGE.max} (0.1 = 10 %)`, min: CV_RANGE.min, max: CV_RANGE.max }),
      distribution: z.enum(DISTRIBUTIONS, { error: (iss) => `${f.label} distribution must be "normal" or "lognormal" (got ${describeValue(iss.input)})` }).default("normal"),
    },
    { error: (iss) => `${f.label} must be { mean, cv, distribution } (got ${describeValue(iss.input)})` },
  );
}

type Tree = { [key: string]: Tree | PopulationField };
const isField = (n: Tree | PopulationField): n is PopulationField => typeof (n as PopulationField).path === "string";

function fieldTree(): Tree {
  const root: Tree = {};
  for (const f of POPULATION_FIELDS) {
    const keys = f.path.split(".");
    let node = root;
    for (const k of keys.slice(0, -1)) node = (node[k] ??= {}) as Tree;
    node[keys[keys.length - 1]] = f;
  }
  return root;
}

const fieldsUnder = (n: Tree | PopulationField): PopulationField[] => (isField(n) ? [n] : Object.values(n).flatMap(fieldsUnder));
/** A part every model uses is required; a part only some models use is optional (and required by those models). */
const usedByAll = (n: Tree | PopulationField) => SHELL_MODELS.every((m) => fieldsUnder(n).some((f) => f.models.includes(m)));

function nodeSchema(name: string, node: Tree): z.ZodType {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, child] of Object.entries(node)) {
    shape[key] = isField(child) ? leafSchema(child) : nodeSchema(key, child);
    if (!isField(child) && !usedByAll(child)) shape[key] = shape[key].optional();
  }
  return z.object(shape, { error: (iss) => `${name} must be an object of its parameters (got ${describeValue(iss.input)})` });
}

const TREE = fieldTree();
/** Top-level parts only some models use (membrane, wall, nucleus), with the models that need them. */
const PARTS = Object.entries(TREE)
  .filter(([, n]) => !isField(n) && !usedByAll(n))
  .map(([key, n]) => ({ key, models: SHELL_MODELS.filter((m) => fieldsUnder(n).some((f) => f.models.includes(m))) }));

/**
 * The geometry rule, from the physics of nested shells: every layer must fit inside the one around it, leaving the
 * interior a positive radius (the engine's own rule for a particle: shells add up to less than the outer radius).
 * Wall plus membrane must be thinner than the cell radius; the nucleus must fit inside the membrane, and the nuclear
 * envelope inside the nucleus. Checked on the means; sampled cells are kept inside by `fitLayer`.
 * @example layerProblems({ model: "walled", radius: { mean: 1e-6, … }, wall: { thickness: { mean: 0.6e-6, … } }, membrane: { thickness: 7e-9, … } }) // []
 */
export function layerProblems(p: PopulationSpec): { path: string[]; message: string }[] {
  const out: { path: string[]; message: string }[] = [];
  const r = p.radius.mean;
  const um = (x: number) => formatIn(x >= 1e-6 ? "um" : "nm", x, 4);
  const membrane = p.model === "homogeneous" ? 0 : (p.membrane?.thickness ?? 0);
  const wall = p.model === "walled" ? (p.wall?.thickness.mean ?? 0) : 0;
  if (p.model === "walled" && p.wall && !(wall + membrane < r)) {
    out.push({ path: ["wall", "thickness", "mean"], message: `wall thickness ${um(wall)} plus membrane thickness ${um(membrane)} must be less than the cell radius ${um(r)}, so the interior keeps a positive radius` });
  } else if (p.model !== "homogeneous" && p.membrane && !(membrane < r)) {
    out.push({ path: ["membrane", "thickness"], message: `membrane thickness ${um(membrane)} must be less than the cell radius ${um(r)}, so the interior keeps a positive radius` });
  }
  if (p.model === "nucleated" && p.nucleus && p.membrane) {
    const nucleus = p.nucleus.radiusFraction.mean * r;
    if (!(nucleus + membrane < r)) out.push({ path: ["nucleus", "radiusFraction", "mean"], message: `the nucleus (radius ${um(nucleus)}) must fit inside the membrane (inner radius ${um(r - membrane)})` });
    else if (!(p.nucleus.envelope.thickness < nucleus)) out.push({ path: ["nucleus", "envelope", "thickness"], message: `nuclear envelope thickness ${um(p.nucleus.envelope.thickness)} must be less than the nucleus radius ${um(nucleus)}` });
  }
  return out;
}

/** Largest share of the room inside its outer neighbour a sampled layer may take (keeps every layer positive). */
export const LAYER_ROOM_SHARE = 0.999;

/**
 * A layer's thickness kept inside the room its outer neighbour leaves (for sampled cells, whose drawn radius may be
 * smaller than the mean); a thickness that satisfies `layerProblems` is returned unchanged.
 * @example fitLayer(0.6e-6, 1e-6) // 0.6e-6
 * @example fitLayer(2e-6, 1e-6) // 0.999e-6
 */
export function fitLayer(thickness: number, room: number): number {
  return thickness < room ? thickness : LAYER_ROOM_SHARE * room;
}

/** The population's dielectric model with spreads (SI), derived from the field table. */
export const populationSpecSchema = (nodeSchema("population", TREE) as z.ZodObject)
  .extend({ model: z.enum(SHELL_MODELS, { error: (iss) => `model must be one of ${SHELL_MODELS.join(", ")} (got ${describeValue(iss.input)})` }) })
  .superRefine((raw, ctx) => {
    const p = raw as unknown as PopulationSpec;
    let complete = true;
    for (const part of PARTS) {
      if (part.models.includes(p.model) && (p as unknown as Record<string, unknown>)[part.key] === undefined) {
        complete = false;
        ctx.addIssue({ code: "custom", path: [part.key], message: `the ${p.model} model needs the ${part.key} parameters` });
      }
    }
    if (complete) for (const issue of layerProblems(p)) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  }) as unknown as z.ZodType<PopulationSpec, PopulationSpecInput>;

/**
 * The field table's defaults as an SI spec of one model (only that model's parameters).
 * @example defaultPopulationSpec("walled").wall?.thickness.mean // 2.2e-7 (m)
 */
export function defaultPopulationSpec(model: ShellModel = "single-shell"): PopulationSpec {
  const out: Record<string, unknown> = { model };
  for (const f of POPULATION_FIELDS) {
    if (!f.models.includes(model)) continue;
    setValueAt(out, f.path, f.spread ? { ...f.default } : f.default.mean);
  }
  return out as unknown as PopulationSpec;
}
