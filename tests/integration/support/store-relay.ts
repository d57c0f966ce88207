import net from "node:net";

/**
 * A TCP relay in front of the object store at `storeEndpoint` that can be "switched off": `onRequest(n)` is asked
 * before the n-th HTTP request (from 1) is passed on; when it returns false every connection is cut and the port closed.
 * @example const store = await relay(process.env.S3_ENDPOINT!, (n) => n < 2); process.env.S3_ENDPOINT = store.endpoint;
 */
export async function relay(storeEndpoint: string, onRequest: (n: number) => boolean): Promise<{ endpoint: string; close: () => Promise<void> }> {
  const target = new URL(storeEndpoint);
  const sockets = new Set<net.Socket>();
  let requests = 0;
  let down = false;
  const server = net.createServer((client) => {
    sockets.add(client);
    const upstream = net.connect(Number(target.port), target.hostname);
    sockets.add(upstream);
    client.on("data", (chunk) => {
      if (down) return;
      if (/^(PUT|GET|HEAD|POST|DELETE) /.test(chunk.subarray(0, 8).toString("latin1")) && !onRequest(++requests)) {
        down = true;
        for (const s of sockets) s.destroy();
        server.close();
        return;
      }
      upstream.write(chunk);
    });
    upstream.on("data", (chunk) => client.write(chunk));
    const end = () => { client.destroy(); upstream.destroy(); };
    client.on("close", end);
    upstream.on("close", end);
    client.on("error", end);
    upstream.on("error", end);
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  return { endpoint: `http://127.0.0.1:${port}`, close: () => new Promise((resolve) => { for (const s of sockets) s.destroy(); server.close(() => resolve()); }) };
}
