import type { AppContext } from '../../lib/context';
import type { RouteDef } from '../../lib/auth/routes';

export function healthRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      method: 'get', path: '/health', access: 'public',
      handler: async (_req, res) => {
        try {
          await Promise.race([
            ctx.db.query('SELECT 1'),
            new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2000)),
          ]);
          res.json({ status: 'ok', db: 'ok' });
        } catch {
          res.status(503).json({ status: 'degraded', db: 'down' });
        }
      },
    },
  ];
}
