/**
 * Runs once when the server starts: stamps each request with its unforgeable peer address (lib/http/client-address.ts).
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { installPeerAddressHook } = await import("@/lib/http/client-address");
  installPeerAddressHook();
}
