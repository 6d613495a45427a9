import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { Organisation } from './organisation.entity';

export function organisationsRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      // Staff and admin see every organisation (they invite across them); others only their own.
      method: 'get', path: '/organisations', access: 'signed_in', scope: 'organisation',
      handler: async (req, res) => {
        const user = currentUser(req);
        const repo = ctx.db.getRepository(Organisation);
        const all = ['admin', 'staff', 'finance'].includes(user.role);
        const rows = all ? await repo.find({ order: { name: 'ASC' } }) : await repo.find({ where: { id: user.organisationId } });
        res.json({ organisations: rows.map((o) => ({ id: o.id, name: o.name, kind: o.kind })) });
      },
    },
  ];
}
