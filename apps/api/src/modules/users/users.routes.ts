import { inviteInputSchema, updateUserInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { toUserDto } from './user.dto';
import { usersService } from './users.service';

export function usersRoutes(ctx: AppContext): RouteDef[] {
  const service = usersService(ctx);
  return [
    {
      method: 'get', path: '/users', access: ['admin'],
      handler: async (_req, res) => { res.json({ users: (await service.list()).map(toUserDto) }); },
    },
    {
      method: 'post', path: '/users/invitations', access: ['admin', 'staff', 'pi'], scope: 'organisation',
      handler: async (req, res) => {
        const user = await service.invite(currentUser(req), inviteInputSchema.parse(req.body), String(req.id));
        res.status(201).json({ user: toUserDto(user) });
      },
    },
    {
      method: 'patch', path: '/users/:id', access: ['admin'],
      handler: async (req, res) => {
        const user = await service.update(currentUser(req), param(req, 'id'), updateUserInputSchema.parse(req.body), String(req.id));
        res.json({ user: toUserDto(user) });
      },
    },
  ];
}
