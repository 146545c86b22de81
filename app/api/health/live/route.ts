// GET /api/health/live: liveness, whether this process answers at all (never asks the database, so a
// database outage does not get healthy app servers restarted). Readiness is /api/health/ready.
import pkg from '@/package.json';

export const dynamic = 'force-dynamic';

export function GET() {
  return Response.json(
    { data: { status: 'ok', version: pkg.version, uptimeS: Math.round(process.uptime()) } },
    { headers: { 'Cache-Control': 'no-store' } },
  );
}
