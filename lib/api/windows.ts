/**
 * The planner behind POST /api/v1/windows and POST /api/v1/windows/sensitivity: validate the body with the
 * planner's zod schema (and, for sensitivity, the window to analyse), run the planner, return plain JSON.
 */
import { z } from "zod";
import { describeValue, LIMITS, mediumConductivitySchema, parseOrThrow, quantity } from "@/lib/dielectric";
import { planWindows, sensitivity, windowsRequestSchema, type SensitivityResult, type WindowsRequest, type WindowsResult } from "@/lib/planner";

const bandEdge = (what: string) =>
  quantity({ what: `${what} (Hz)`, range: "from 1 Hz to 10 GHz (1 to 1e10 Hz)", min: LIMITS.minFrequency, max: LIMITS.maxFrequency });

/** The window whose sensitivity is wanted: its medium conductivity (S/m) and band edges (Hz), as planWindows gives them. */
export const windowRefSchema = z
  .object(
    { conductivity: mediumConductivitySchema, bandStart: bandEdge("band start"), bandStop: bandEdge("band stop") },
    { error: (iss) => `window must be { conductivity (S/m), bandStart (Hz), bandStop (Hz) } (got ${describeValue(iss.input)})` },
  )
  .superRefine((w, ctx) => {
    if (!(w.bandStop > w.bandStart)) {
      ctx.addIssue({ code: "custom", path: ["bandStop"], message: `band stop (${describeValue(w.bandStop)} Hz) must be above band start (${describeValue(w.bandStart)} Hz)` });
    }
  });

/** Body of POST /api/v1/windows/sensitivity: the planning request and one of its windows. */
export const sensitivityRequestSchema = z.object(
  { request: windowsRequestSchema, window: windowRefSchema },
  { error: (iss) => `the body must be { request: <windows request>, window: { conductivity, bandStart, bandStop } } (got ${describeValue(iss.input)})` },
);

/**
 * Validates a windows request body and plans it: ranked operating windows, the sweep map and warnings (SI units).
 * @example computeWindows(WINDOWS_EXAMPLE.body).windows[0].operatingPoint // → { frequency: 7.4e6, conductivity: 0.1 }
 */
export function computeWindows(body: unknown): WindowsResult {
  parseOrThrow(windowsRequestSchema, body);
  return planWindows(body as WindowsRequest);
}

/**
 * Validates a sensitivity body and computes how far ±1 SD of each population parameter moves the band edges.
 * @example computeSensitivity({ request, window: { conductivity: 0.1, bandStart: 1e6, bandStop: 6.3e7 } }).dominant
 */
export function computeSensitivity(body: unknown): SensitivityResult {
  parseOrThrow(sensitivityRequestSchema, body);
  const { request, window } = body as { request: WindowsRequest; window: z.infer<typeof windowRefSchema> };
  return sensitivity(request, window);
}
