// Runs once when the server starts (Next.js instrumentation hook; Next.js skips it during `next build`):
// the environment is parsed here, so bad configuration stops the app at start, naming each variable,
// instead of failing on the first request that reads it.
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { serverEnv } = await import('./lib/server/config/env');
  try {
    serverEnv();
  } catch (err) {
    console.error(`[boreline] not starting: ${(err as Error).message}`);
    process.exit(1);
  }
  // The mail outbox's worker: sends what requests queued, after their answers (lib/server/mail/outbox-worker.ts).
  const { startOutboxWorker } = await import('./lib/server/mail/outbox-worker');
  startOutboxWorker();
  // The record chain's worker: links what was recorded, signs end-of-day checkpoints, nightly self-check.
  const { startChainWorker } = await import('./lib/server/chain/chain-worker');
  startChainWorker();
}
