/**
 * A request body sent without Content-Length (chunked), produced chunk by chunk on demand, and a count of how many
 * bytes the reader actually pulled — so a test can prove a cap stopped reading early.
 */
export function chunkedBody(totalBytes: number, chunkBytes = 64 * 1024, fill = 0x20): { stream: ReadableStream<Uint8Array>; pulled: () => number } {
  let sent = 0;
  const chunk = new Uint8Array(chunkBytes).fill(fill);
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= totalBytes) return controller.close();
      const n = Math.min(chunkBytes, totalBytes - sent);
      sent += n;
      controller.enqueue(n === chunkBytes ? chunk : chunk.slice(0, n));
    },
  });
  return { stream, pulled: () => sent };
}

/** A POST request whose body is a chunked stream (no Content-Length). */
export function chunkedRequest(url: string, stream: ReadableStream<Uint8Array>, headers: Record<string, string>): Request {
  return new Request(url, { method: "POST", body: stream, headers, duplex: "half" } as RequestInit);
}
