import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { serverEnv } from '@/lib/server/config/env';
import { logger } from '@/lib/server/observability';
import { linkChainsNow, runSelfCheck, signCheckpointNow } from './chain-service';

// Each app server's record-chain worker (started by instrumentation.ts): links what was recorded every
// CHAIN_LINK_INTERVAL_MS (several servers take turns per chain through its advisory lock), signs a
// checkpoint for each meeting whose meeting day (in the meeting's time zone) has ended since its last
// link, and re-verifies every chain every CHAIN_CHECK_INTERVAL_MS (nightly by default).

type State = { timer?: NodeJS.Timeout; checkTimer?: NodeJS.Timeout; running: boolean };
const g = globalThis as unknown as { __borelineChainWorker?: State };

/** Meetings whose last chained record was on an earlier local day than today, with no checkpoint since. */
async function signEndOfDay() {
  const due = await getDb().sequelize.query<{ eventId: string; day: string }>(
    `select e.id as "eventId", to_char((h.linked_at at time zone e.time_zone)::date, 'YYYY-MM-DD') as day
       from events e
       join lateral (select l.seq, l.linked_at from chain_links l where l.chain_key = e.id::text
                      order by l.seq desc limit 1) h on true
      where (h.linked_at at time zone e.time_zone)::date < (now() at time zone e.time_zone)::date
        and not exists (select 1 from chain_checkpoints c where c.chain_key = e.id::text and c.count >= h.seq)`,
    { type: QueryTypes.SELECT },
  );
  for (const d of due) await signCheckpointNow(d.eventId, `end of meeting day ${d.day}`);
}

async function tick(state: State) {
  if (state.running) return;
  state.running = true;
  try {
    await linkChainsNow();
    await signEndOfDay();
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
