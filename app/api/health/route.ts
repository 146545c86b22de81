// GET /api/health: the app's version and whether the database answers (503 when it does not).
import { getDb } from '@/lib/server/db';
import pkg from '@/package.json';

export const dynamic = 'force-dynamic';

export async function GET() {
  const started = performance.now();
  try {
    await Promise.race([
      getDb().sequelize.query('select 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error('database timeout')), 2000)),
    ]);
    return Response.json({ data: { status: 'ok', version: pkg.version, database: 'up', databaseMs: Math.round(performance.now() - started) } });
  } catch {
    return Response.json(
      { data: { status: 'degraded', version: pkg.version, database: 'down' } },
      { status: 503, headers: { 'Retry-After': '5', 'Cache-Control': 'no-store' } },
    );
  }
}
