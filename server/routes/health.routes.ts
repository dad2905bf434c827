import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';

/** `GET /api/health`: 200 when MariaDB answers within two seconds, 503 otherwise. */
export function healthRoutes(deps: AppDeps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/health',
      access: 'public',
      summary: 'Service and database status',
      handler: async (_req, res) => {
        const up = await Promise.race([
          deps.dataSource.query('SELECT 1').then(() => true, () => false),
          new Promise<boolean>((r) => setTimeout(() => r(false), 2000).unref()),
        ]);
        res.status(up ? 200 : 503);
        return { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down' };
      },
    },
  ];
}
