/**
 * Runs once when the server starts: checks every environment variable (lib/env.ts; a bad value stops the start with
 * a message naming it), refuses to run holding the migrator's database credentials (db/config.ts) and stamps each request with its unforgeable peer address (lib/http/client-address.ts).
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { checkEnv } = await import("@/lib/env");
  checkEnv();
  const { assertNoMigratorCredentials } = await import("@/db/config");
  assertNoMigratorCredentials();
  const { installPeerAddressHook } = await import("@/lib/http/client-address");
  installPeerAddressHook();
}
