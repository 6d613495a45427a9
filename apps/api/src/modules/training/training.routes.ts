import {
  configurationRequirementsInputSchema, courseInputSchema, courseUpdateSchema, grantSignoffInputSchema,
  recordTrainingInputSchema, revokeInputSchema, trainingPeopleQuerySchema,
} from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { listCourses, personTraining, requirementsOf, searchPeople } from './training.queries';
import { trainingService } from './training.service';

/**
 * Everyone reads the courses, the configurations' requirements and their own training; staff and admin read anyone's.
 * Writes are open to staff and admin by role and then need the laser-safety officer flag (403 not_laser_safety_officer).
 */
export function trainingRoutes(ctx: AppContext): RouteDef[] {
  const service = trainingService(ctx);
  const facilityRoles = ['staff', 'admin'] as const;
  return [
    { method: 'get', path: '/training/courses', access: 'signed_in', handler: async (_req, res) => { res.json({ courses: await listCourses(ctx.db) }); } },
    {
      method: 'post', path: '/training/courses', access: facilityRoles,
      handler: async (req, res) => { res.status(201).json({ course: await service.createCourse(currentUser(req), courseInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'patch', path: '/training/courses/:id', access: facilityRoles,
      handler: async (req, res) => { res.json({ course: await service.updateCourse(currentUser(req), param(req, 'id'), courseUpdateSchema.parse(req.body), String(req.id)) }); },
    },
    { method: 'get', path: '/training/requirements', access: 'signed_in', handler: async (_req, res) => { res.json({ requirements: await requirementsOf(ctx.db) }); } },
    {
      method: 'put', path: '/training/requirements/:id', access: facilityRoles,
      handler: async (req, res) => {
        res.json({ requirements: await service.setRequirements(currentUser(req), param(req, 'id'), configurationRequirementsInputSchema.parse(req.body), String(req.id)) });
      },
    },
    { method: 'get', path: '/training/me', access: 'signed_in', handler: async (req, res) => { res.json(await personTraining(ctx.db, currentUser(req).id)); } },
    {
      method: 'get', path: '/training/people', access: facilityRoles,
      handler: async (req, res) => { res.json({ people: await searchPeople(ctx.db, trainingPeopleQuerySchema.parse(req.query).q) }); },
    },
    { method: 'get', path: '/training/people/:id', access: facilityRoles, handler: async (req, res) => { res.json(await personTraining(ctx.db, param(req, 'id'))); } },
    {
      method: 'post', path: '/training/records', access: facilityRoles,
      handler: async (req, res) => { res.status(201).json({ record: await service.recordTraining(currentUser(req), recordTrainingInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/training/records/:id/revoke', access: facilityRoles,
      handler: async (req, res) => { res.json({ record: await service.revokeTraining(currentUser(req), param(req, 'id'), revokeInputSchema.parse(req.body).reason, String(req.id)) }); },
    },
    {
      method: 'post', path: '/training/signoffs', access: facilityRoles,
      handler: async (req, res) => { res.status(201).json({ signoff: await service.grantSignoff(currentUser(req), grantSignoffInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/training/signoffs/:id/revoke', access: facilityRoles,
      handler: async (req, res) => { res.json({ signoff: await service.revokeSignoff(currentUser(req), param(req, 'id'), revokeInputSchema.parse(req.body).reason, String(req.id)) }); },
    },
  ];
}
