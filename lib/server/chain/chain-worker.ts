import 'server-only';
import { serverEnv } from '@/lib/server/config/env';
import { logger } from '@/lib/server/observability';
import { keyDir, linkChainsNow, runSelfCheck, withChainClient } from './chain-service';
import { signEndOfDayCheckpoints } from './chain-db';
import { requestsInFlight } from '@/lib/server/http/in-flight';
import { createBusyGate, type BusyGate } from '@/lib/core/concurrency/busy-gate';

// Each app server's record-chain worker (started by instrumentation.ts): links what was recorded every
// CHAIN_LINK_INTERVAL_MS (several servers take turns per chain through its advisory lock), signs a
// checkpoint for each meeting whose meeting day (in the meeting's time zone) has ended since its last
// link, and re-verifies every chain every CHAIN_CHECK_INTERVAL_MS (nightly by default). Linking waits while
// the server is answering requests, for CHAIN_BUSY_DEFER_MS at most (as the mail outbox does): a burst of
// records at the dock is answered first, and linked (hashing each record) a moment later.

type State = { timer?: NodeJS.Timeout; checkTimer?: NodeJS.Timeout; running: boolean; busy: BusyGate };
const g = globalThis as unknown as { __borelineChainWorker?: State };

async function tick(state: State) {
  if (state.running) return;
  if (state.busy.shouldWait(requestsInFlight(), Date.now())) return;
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
  const state: State = { running: false, busy: createBusyGate(() => serverEnv().CHAIN_BUSY_DEFER_MS) };
  g.__borelineChainWorker = state;
  state.timer = setInterval(() => void tick(state), serverEnv().CHAIN_LINK_INTERVAL_MS);
  state.timer.unref();
  state.checkTimer = setInterval(
    () => void runSelfCheck(null).catch((err) => logger().error({ err }, 'record chain: self-check failed')),
    serverEnv().CHAIN_CHECK_INTERVAL_MS,
  );
  state.checkTimer.unref();
}
