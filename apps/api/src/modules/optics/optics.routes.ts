import { analysePoints, assertPointCount, checkTargetFeasibility, describeWavelength, opaMixing, opaRangesOf, bookingTargetSchema } from '@femtoslot/shared';
import multer from 'multer';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import type { RouteDef } from '../../lib/auth/routes';
import { AppError, notFound } from '../../lib/errors/app-error';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { analyseTraceText, checkPulse, yieldToEventLoop } from './trace-analysis';

const mixingQuerySchema = z.object({ pumpNm: z.coerce.number().positive().finite(), signalNm: z.coerce.number().positive().finite() });
const feasibilityInputSchema = z.intersection(z.object({ configurationId: z.uuid() }), bookingTargetSchema);
const shapeSchema = z.enum(['gaussian', 'sech2']);
// Centre wavelength and spectral FWHM (nm), both optional: they set the optical-cycle and transform-limit checks.
const pulseContextSchema = z.object({
  centreNm: z.coerce.number().positive().finite().max(100_000).optional(),
  spectralFwhmNm: z.coerce.number().positive().finite().max(100_000).optional(),
});
const autocorrelationJsonSchema = pulseContextSchema.extend({
  shape: shapeSchema,
  points: z.array(z.tuple([z.number().finite(), z.number().finite()])),
});
// A trace is a small text file; 2 MB is generous and keeps the upload in memory.
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: 2 * 1024 * 1024, files: 1, fields: 5 } });

export function opticsRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      method: 'get', path: '/optics/mixing', access: 'signed_in',
      handler: (req, res) => {
        const q = mixingQuerySchema.parse(req.query);
        const mix = opaMixing(q.pumpNm, q.signalNm);
        if (mix.degenerate || mix.dfgNm === null) {
          throw new AppError('degenerate', `Signal ${q.signalNm} nm is at degeneracy (twice the pump): signal and idler coincide and DFG is undefined`, 422, { pumpNm: q.pumpNm, signalNm: q.signalNm });
        }
        res.json({
          pumpNm: q.pumpNm, signalNm: q.signalNm, idlerNm: mix.idlerNm, dfgNm: mix.dfgNm,
          pump: describeWavelength(q.pumpNm), signal: describeWavelength(q.signalNm), idler: describeWavelength(mix.idlerNm), dfg: describeWavelength(mix.dfgNm),
        });
      },
    },
    {
      method: 'post', path: '/optics/feasibility', access: 'signed_in',
      handler: async (req, res) => {
        const input = feasibilityInputSchema.parse(req.body);
        const reference = await ctx.reference.get(ctx.db.manager, req.referenceRevision);
        const c = reference.configurations.get(input.configurationId);
        const timeline = c && reference.timelines.get(c.instrumentId);
        if (!c || !timeline) throw notFound('Configuration');
        const target = 'targetNm' in input ? { targetNm: input.targetNm } : { minNm: input.minNm, maxNm: input.maxNm };
        const r = checkTargetFeasibility(target, {
          outputKind: c.outputKind, minNm: c.minNm, maxNm: c.maxNm, pumpNm: timeline.instrument.pumpNm ?? undefined, name: c.name,
          opa: opaRangesOf(timeline.configurations.values()),
        });
        res.json({ ...r, configuration: { id: c.id, name: c.name, minNm: c.minNm, maxNm: c.maxNm, requiredOdBands: c.requiredOdBands } });
      },
    },
    {
      method: 'post', path: '/optics/autocorrelation', access: 'signed_in', before: [upload.single('trace')],
      handler: async (req, res) => {
        let result;
        let pulse;
        if (req.file) {
          const shape = shapeSchema.parse(req.body?.shape);
          pulse = pulseContextSchema.parse(req.body ?? {});
          result = await analyseTraceText(req.file.buffer.toString('utf8'), shape);
        } else {
          // Counted before validation: a huge array costs time in every later pass.
          assertPointCount(Array.isArray(req.body?.points) ? req.body.points.length : 0);
          const body = autocorrelationJsonSchema.parse(req.body);
          pulse = body;
          await yieldToEventLoop();
          result = analysePoints(body.points as Array<[number, number]>, body.shape);
        }
        const limits = await checkPulse(ctx, result.pulseFwhmFs, result.shape, pulse);
        res.json({ acFwhmFs: result.autocorrelationFwhmFs, pulseFwhmFs: result.pulseFwhmFs, shape: result.shape, baseline: result.baseline, peakDelayFs: result.peakDelayFs, deconvolutionFactor: result.deconvolutionFactor, ...limits });
      },
    },
  ];
}
