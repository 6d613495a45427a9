import { isoInstantSchema, utilisationQuerySchema } from '@femtoslot/shared';
import { toCsv, type CsvCell } from '@femtoslot/shared/csv/csv-export';
import type { Response } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { reportsService } from './reports.service';

const coverageQuerySchema = z
  .object({ from: isoInstantSchema(), to: isoInstantSchema(), instrumentId: z.uuid().optional() })
  .refine((q) => Date.parse(q.to) > Date.parse(q.from), { message: 'to must be after from', path: ['to'] });

export function sendCsv(res: Response, filename: string, columns: string[], rows: CsvCell[][]): void {
  res.type('text/csv; charset=utf-8').attachment(filename).send(toCsv([columns, ...rows]));
}

export function reportsRoutes(ctx: AppContext): RouteDef[] {
  const s = reportsService(ctx);
  const readers = ['pi', 'staff', 'finance', 'admin'] as const;
  return [
    { method: 'get', path: '/reports/utilisation', access: readers, scope: 'organisation', handler: async (req, res) => { res.json(await s.utilisation(currentUser(req), utilisationQuerySchema.parse(req.query))); } },
    {
      method: 'get', path: '/reports/utilisation.csv', access: readers, scope: 'organisation',
      handler: async (req, res) => {
        const r = await s.utilisation(currentUser(req), utilisationQuerySchema.parse(req.query));
        sendCsv(res, 'utilisation.csv', ['period', 'instrument', 'booked_hours', 'logged_hours', 'maintenance_hours', 'changeover_hours'],
          r.rows.map((x) => [x.period, x.instrumentName, x.bookedHours, x.loggedHours, x.maintenanceHours, x.changeoverHours]));
      },
    },
    { method: 'get', path: '/reports/tuning-coverage', access: readers, scope: 'organisation', handler: async (req, res) => { res.json(await s.tuningCoverage(currentUser(req), coverageQuerySchema.parse(req.query))); } },
    {
      method: 'get', path: '/reports/tuning-coverage.csv', access: readers, scope: 'organisation',
      handler: async (req, res) => {
        const r = await s.tuningCoverage(currentUser(req), coverageQuerySchema.parse(req.query));
        sendCsv(res, 'tuning-coverage.csv', ['starts_at', 'configuration', 'min_nm', 'max_nm'], r.segments.map((x) => [x.startsAt, x.configurationName, x.minNm, x.maxNm]));
      },
    },
    {
      method: 'get', path: '/reports/pulse-trend.csv', access: readers, scope: 'organisation',
      handler: async (req, res) => {
        const r = await s.tuningCoverage(currentUser(req), coverageQuerySchema.parse(req.query));
        sendCsv(res, 'pulse-trend.csv', ['starts_at', 'configuration', 'pulse_shape', 'pulse_fwhm_fs', 'autocorrelation_fwhm_fs'],
          r.pulseTrend.map((x) => [x.startsAt, x.configurationKey, x.pulseShape ?? '', x.pulseFwhmFs, x.autocorrelationFwhmFs ?? '']));
      },
    },
  ];
}
