/**
 * The CSV downloads of the public API, for the OpenAPI document: the compute routes' CSV forms (same request bodies
 * as their JSON forms) and a saved protocol version's tables.
 */

const csvContent = (description: string) => ({ "text/csv": { schema: { type: "string", description } } });
const errors = {
  "400": { description: "Invalid request: the message names the field, the value and the allowed range.", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "401": { description: "Not signed in and no valid token.", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
};

const computeCsv = (operationId: string, summary: string, requestName: string, columns: string) => ({
  post: {
    operationId,
    summary,
    description: `Takes the same JSON body as the JSON route and answers CSV (comma separated, CRLF line ends, one header row). Numbers are SI at full precision; each header names its unit. Columns: ${columns}.`,
    requestBody: { required: true, content: { "application/json": { schema: { $ref: `#/components/schemas/${requestName}` } } } },
    responses: { "200": { description: "The table as CSV.", content: csvContent(columns) }, ...errors },
  },
});

/** OpenAPI path items of the CSV routes. */
export const CSV_PATHS: Record<string, Record<string, unknown>> = {
  "/api/v1/windows/map.csv": computeCsv("sweepMapCsv", "Sweep map in long format (CSV)", "WindowsRequest", "frequency (Hz), medium conductivity (S/m), Re[K] of each population's mean cell, predicted recovery and purity (fractions), feasible (1/0), drive voltage (V rms), blocking limits (names)"),
  "/api/v1/windows/table.csv": computeCsv("windowsCsv", "Ranked operating windows (CSV)", "WindowsRequest", "rank, score, operating point, band, region span, drive (Vpp, Vrms), recovery, purity, temperature rise (checked, isolated pair, electrode array; K), electrothermal ratio, transmembrane potential (V), AC electro-osmosis, warnings"),
  "/api/v1/spectra.csv": computeCsv("spectraCsv", "Spectra of each particle in one medium (CSV)", "SpectraRequest", "frequency (Hz), medium conductivity (S/m), Re[K] and Im[K] of each particle"),
  "/api/v1/protocols/{id}/versions/{n}/exports/{table}": {
    get: {
      operationId: "versionCsv",
      summary: "A saved protocol version's sweep map, window table or spectra (CSV)",
      description: "The tables of a saved version, from the planner result frozen with it: table = sweep-map (long format, as /api/v1/windows/map.csv), windows (as /api/v1/windows/table.csv) or spectra (both populations' mean cells at the chosen conductivity, 1 kHz–1 GHz). Technicians see approved versions only.",
      parameters: [
        { name: "id", in: "path", required: true, schema: { type: "integer" } },
        { name: "n", in: "path", required: true, schema: { type: "integer" } },
        { name: "table", in: "path", required: true, schema: { type: "string", enum: ["sweep-map", "windows", "spectra"] } },
      ],
      responses: { "200": { description: "The table as CSV.", content: csvContent("See the summary for the columns.") }, "404": { description: "No such protocol version, or not visible to you." }, ...errors },
    },
  },
};
