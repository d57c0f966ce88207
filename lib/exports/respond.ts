/**
 * The HTTP answer of a CSV download.
 * @example csvResponse("a,b\r\n", "sievewright-x.csv").headers.get("content-type") // → "text/csv; charset=utf-8"
 */
export function csvResponse(csv: string, fileName: string): Response {
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${fileName}"`,
      "cache-control": "no-store",
    },
  });
}
