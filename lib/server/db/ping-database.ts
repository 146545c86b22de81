import 'server-only';
import { getDb } from './index';

/** How long the database took to answer `select 1`, in ms; throws when it does not answer within timeoutMs. */
export async function pingDatabase(timeoutMs = 2000): Promise<number> {
  const started = performance.now();
  let timer: ReturnType<typeof setTimeout> | undefined;
  try {
    await Promise.race([
      getDb().sequelize.query('select 1'),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('database timeout')), timeoutMs);
      }),
    ]);
  } finally {
    clearTimeout(timer);
  }
  return Math.round(performance.now() - started);
}
