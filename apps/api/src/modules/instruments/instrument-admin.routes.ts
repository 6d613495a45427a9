import {
  changeoverPairsInputSchema, configurationInputSchema, configurationUpdateInputSchema, instrumentInputSchema, instrumentUpdateInputSchema,
} from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { instrumentAdminService } from './instrument-admin.service';

/**
 * Sources, benches, their configurations and changeover model, edited by staff and admins. Each change has a preview
 * route with the same body that lists the future bookings it would affect, computed with the booking rules.
 * Required ODs are set by the laser-safety officer; staff record them here.
 */
export function instrumentAdminRoutes(ctx: AppContext): RouteDef[] {
  const s = instrumentAdminService(ctx);
  const who = ['staff', 'admin'] as const;
  return [
    { method: 'get', path: '/instruments/manage', access: who, handler: async (_req, res) => { res.json({ instruments: await s.list() }); } },
    {
      method: 'post', path: '/instruments', access: who,
      handler: async (req, res) => { res.status(201).json({ instrument: await s.createInstrument(currentUser(req), instrumentInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/instruments/:id/preview', access: who,
      handler: async (req, res) => { res.json({ affected: await s.previewInstrument(param(req, 'id'), instrumentUpdateInputSchema.parse(req.body)) }); },
    },
    {
      method: 'patch', path: '/instruments/:id', access: who,
      handler: async (req, res) => { res.json({ instrument: await s.updateInstrument(currentUser(req), param(req, 'id'), instrumentUpdateInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/configurations', access: who,
      handler: async (req, res) => { res.status(201).json({ instrument: await s.createConfiguration(currentUser(req), configurationInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/configurations/:id/preview', access: who,
      handler: async (req, res) => { res.json({ affected: await s.previewConfiguration(param(req, 'id'), configurationUpdateInputSchema.parse(req.body)) }); },
    },
    {
      method: 'patch', path: '/configurations/:id', access: who,
      handler: async (req, res) => { res.json(await s.updateConfiguration(currentUser(req), param(req, 'id'), configurationUpdateInputSchema.parse(req.body), String(req.id))); },
    },
    {
      method: 'post', path: '/instruments/:id/changeover-pairs/preview', access: who,
      handler: async (req, res) => { res.json({ affected: await s.previewPairs(param(req, 'id'), changeoverPairsInputSchema.parse(req.body)) }); },
    },
    {
      method: 'put', path: '/instruments/:id/changeover-pairs', access: who,
      handler: async (req, res) => { res.json({ instrument: await s.replacePairs(currentUser(req), param(req, 'id'), changeoverPairsInputSchema.parse(req.body), String(req.id)) }); },
    },
  ];
}
