// GET /api/health/ready: readiness, whether this app server can serve requests now (the database
// answers); 503 while it does not, so a load balancer sends traffic elsewhere. Same answer as /api/health.
import { GET as health } from '../route';

export const dynamic = 'force-dynamic';

export const GET = health;
