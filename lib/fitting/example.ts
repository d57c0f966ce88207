import { SHELL_CROSSOVER_DEFAULTS, shellFirstCrossover } from "./shell-crossover";
import { formatConductivity } from "@/lib/units/format";
import { csvNumber } from "@/lib/units/number";

export interface ExampleCsvOptions {
  /** Membrane capacitance, F/m² (default 0.01 = 1 µF/cm²). */
  capacitance?: number;
  /** Membrane conductance, S/m² (default 300). */
  conductance?: number;
  /** Cell radius, m (default 6 µm). */
  radius?: number;
  /** Medium conductivities in mS/m (default 5, 10, 20, 40, 80, 150). */
  conductivitiesMilliSiemensPerMetre?: number[];
  /** Relative scatter added by a fixed sine pattern, so the example fits with finite intervals (default 0.015; 0 for exact values). */
  scatter?: number;
  /** Temperature written in every row, °C (default 22). */
  temperatureC?: number;
  delimiter?: "," | ";";
}

/**
 * A small crossover CSV generated from the engine's full single-shell model with the crossover
 * fit's default cytoplasm, membrane thickness and medium permittivity (PHYSICS §7) for the upload
 * page: conductivity in mS/m, crossover in kHz to four significant digits, temperature in °C.
 * Invented parameters, not measured data.
 * @example
 * exampleCrossoverCsv().split("\n")[0]
 * // "medium conductivity (mS/m),crossover frequency (kHz),temperature (°C)"
 */
export function exampleCrossoverCsv(options: ExampleCsvOptions = {}): string {
  const {
    capacitance = 0.01,
    conductance = 300,
    radius = 6e-6,
    conductivitiesMilliSiemensPerMetre = [5, 10, 20, 40, 80, 150],
    scatter = 0.015,
    temperatureC = 22,
    delimiter = ",",
  } = options;
  const lines = [["medium conductivity (mS/m)", "crossover frequency (kHz)", "temperature (°C)"].join(delimiter)];
  conductivitiesMilliSiemensPerMetre.forEach((mS, k) => {
    const f = shellFirstCrossover(mS / 1000, radius, capacitance, conductance, SHELL_CROSSOVER_DEFAULTS);
    if (f === null) throw new RangeError(`no crossover at ${formatConductivity(mS / 1000)}: σm ≤ r·G = ${formatConductivity(radius * conductance)}; choose a higher conductivity or a lower conductance`);
    const kHz = (f / 1000) * (1 + scatter * Math.sin(2.3 * k + 1));
    lines.push([csvNumber(mS), csvNumber(kHz, 4), csvNumber(temperatureC)].join(delimiter));
  });
  return lines.join("\n") + "\n";
}
