/**
 * Runs once when the server starts: checks every environment variable (lib/env.ts; a bad value stops the start with
 * a message naming it), refuses to run holding the migrator's database credentials (db/config.ts), stamps each
 * request with its unforgeable peer address (lib/http/client-address.ts), and starts the cell-fit worker threads
 * (lib/characterisation/pool.ts), which warm up in the background so the first characterisation is as fast as later
 * ones.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { checkEnv } = await import("@/lib/env");
  checkEnv();
  const { assertNoMigratorCredentials } = await import("@/db/config");
  assertNoMigratorCredentials();
  const { installPeerAddressHook } = await import("@/lib/http/client-address");
  installPeerAddressHook();
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { startFitPool } = await import("@/lib/characterisation/pool");
  try {
    startFitPool();
  } catch (err) {
    // Not built yet (build/workers missing): fits start their threads on first use and report the problem then.
    console.error(`[start] cell-fit threads not started: ${(err as Error).message}`);
  }
}
