import { Router } from 'express';
import { z } from 'zod';
import { expandParam, listParams, parseParams } from '../params';
import { paginate } from '../pagination';
import { resourceMissing } from '../stripe-error';
import { pathId, type RouteContext } from './route-context';

// API reference, "Events": retrieve and list; `type` accepts a trailing wildcard such as `invoice.*`.
const listSchema = z.strictObject({ ...listParams, type: z.string().optional() });

function matchesType(pattern: string | undefined, type: string): boolean {
  if (pattern === undefined) return true;
  if (pattern.endsWith('*')) return type.startsWith(pattern.slice(0, -1));
  return type === pattern;
}

export function eventRoutes(context: RouteContext): Router {
  const router = Router();
  const { store } = context;

  router.get('/v1/events/:id', (req, res) => {
    parseParams(z.strictObject({ expand: expandParam.optional() }), req.query);
    const event = store.data.events[pathId(req)];
    if (!event) throw resourceMissing('event', pathId(req));
    res.json(event);
  });

  router.get('/v1/events', (req, res) => {
    const params = parseParams(listSchema, req.query);
    const events = Object.values(store.data.events).filter((event) => matchesType(params.type, event.type));
    res.json(paginate(events, params, '/v1/events', (event) => event));
  });

  return router;
}
