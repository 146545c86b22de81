import 'server-only';
import { serverEnv } from '@/lib/server/config/env';
import { logger } from '@/lib/server/observability';
import { keyDir, linkChainsNow, runSelfCheck, withChainClient } from './chain-service';
import { signEndOfDayCheckpoints } from './chain-db';

// Each app server's record-chain worker (started by instrumentation.ts): links what was recorded every
// CHAIN_LINK_INTERVAL_MS (several servers take turns per chain through its advisory lock), signs a
// checkpoint for each meeting whose meeting day (in the meeting's time zone) has ended since its last
// link, and re-verifies every chain every CHAIN_CHECK_INTERVAL_MS (nightly by default).

type State = { timer?: NodeJS.Timeout; checkTimer?: NodeJS.Timeout; running: boolean };
const g = globalThis as unknown as { __borelineChainWorker?: State };

async function tick(state: State) {
  if (state.running) return;
  state.running = true;
  try {
    await linkChainsNow();
    await withChainClient((c) => signEndOfDayCheckpoints(c, keyDir()));
  } catch (err) {
    logger().error({ err }, 'record chain: linking failed');
  } finally {
    state.running = false;
  }
}

export function startChainWorker() {
  if (g.__borelineChainWorker) return;
  const state: State = { running: false };
  g.__borelineChainWorker = state;
  state.timer = setInterval(() => void tick(state), serverEnv().CHAIN_LINK_INTERVAL_MS);
  state.timer.unref();
  state.checkTimer = setInterval(
    () => void runSelfCheck(null).catch((err) => logger().error({ err }, 'record chain: self-check failed')),
    serverEnv().CHAIN_CHECK_INTERVAL_MS,
  );
  state.checkTimer.unref();
}
