// GET /api/health: the app's version and whether the database answers (503 when it does not).
import { pingDatabase } from '@/lib/server/db/ping-database';
import pkg from '@/package.json';

export const dynamic = 'force-dynamic';

export async function GET() {
  try {
    const databaseMs = await pingDatabase(2000);
    return Response.json({ data: { status: 'ok', version: pkg.version, database: 'up', databaseMs } });
  } catch {
    return Response.json(
      { data: { status: 'degraded', version: pkg.version, database: 'down' } },
      { status: 503, headers: { 'Retry-After': '5', 'Cache-Control': 'no-store' } },
    );
  }
}
