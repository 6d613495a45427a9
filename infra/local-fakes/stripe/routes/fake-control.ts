import express, { Router } from 'express';
import { ZodError } from 'zod';
import type { KnobsController } from '../knobs';
import { knobsSchema } from '../knobs';
import type { RouteContext } from './route-context';

/** Test-only controls under /_fake; plain JSON, no Stripe envelope, no API key (loopback only). */
export function fakeControlRoutes(context: RouteContext, knobs: KnobsController): Router {
  const router = Router();
  router.use('/_fake', express.json());

  router.get('/_fake/knobs', (_req, res) => {
    res.json(knobs.current);
  });

  router.post('/_fake/knobs', (req, res) => {
    try {
      res.json(knobs.set(knobsSchema.partial().parse(req.body ?? {})));
    } catch (error) {
      if (!(error instanceof ZodError)) throw error;
      res.status(400).json({ error: { code: 'invalid_knobs', message: 'Invalid knobs', details: error.issues } });
    }
  });

  router.post('/_fake/reset', (_req, res) => {
    context.webhooks.cancelAll();
    context.store.reset();
    res.json({ knobs: knobs.reset(), state: 'empty' });
  });

  router.get('/_fake/state', (_req, res) => {
    res.json(context.store.data);
  });

  router.get('/_fake/deliveries', (req, res) => {
    const event = typeof req.query.event === 'string' ? req.query.event : undefined;
    const deliveries = context.store.data.deliveries.filter((d) => event === undefined || d.event === event);
    res.json({ object: 'list', data: deliveries });
  });

  return router;
}
