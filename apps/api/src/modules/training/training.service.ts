import type {
  ConfigurationRequirementsInput, CourseInput, GrantSignoffInput, RecordTrainingInput,
} from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { facilityToday, listCourses, recordsOf, requirementsOf, signoffsOf } from './training.queries';

/** Recording and revoking is the laser-safety officer's duty: a flag on a staff or admin user, checked on every call. */
async function requireOfficer(m: EntityManager, actor: SessionUser): Promise<void> {
  const rows: { lso: boolean }[] = await m.query(`SELECT is_laser_safety_officer AS lso FROM users WHERE id = $1 AND active`, [actor.id]);
  if (!rows[0]?.lso) {
    throw new AppError('not_laser_safety_officer', 'Only a laser-safety officer records or revokes training and sign-offs; ask an admin to name you one', 403);
  }
}

async function activePerson(m: EntityManager, userId: string): Promise<{ id: string; name: string }> {
  const rows: { id: string; name: string }[] = await m.query(`SELECT id, name FROM users WHERE id = $1 AND active`, [userId]);
  if (!rows[0]) throw new AppError('invalid_person', 'That person does not exist or is deactivated', 422, { userId });
  return rows[0];
}

const isRevoked = (what: string, revokedAt: Date) =>
  new AppError('already_revoked', `That ${what} was already revoked on ${revokedAt.toISOString().slice(0, 10)}`, 409, { revokedAt: revokedAt.toISOString() });

export function trainingService(ctx: AppContext) {
  const db = ctx.db;

  async function createCourse(actor: SessionUser, input: CourseInput, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      const [row] = (await m.query(
        `INSERT INTO training_courses (name, description, validity_months, required_for_all, active) VALUES ($1, $2, $3, $4, $5) RETURNING id`,
        [input.name, input.description, input.validityMonths, input.requiredForAll, input.active])) as { id: string }[];
      await recordAudit(m, { actorUserId: actor.id, action: 'training_course.created', entityType: 'training_course', entityId: row!.id, after: { ...input }, requestId });
      return (await listCourses(m)).find((c) => c.id === row!.id)!;
    });
  }

  async function updateCourse(actor: SessionUser, id: string, input: Partial<CourseInput>, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      const before = (await listCourses(m)).find((c) => c.id === id);
      if (!before) throw notFound('Course');
      const after = { ...before, ...input };
      await m.query(`UPDATE training_courses SET name = $2, description = $3, validity_months = $4, required_for_all = $5, active = $6 WHERE id = $1`,
        [id, after.name, after.description, after.validityMonths, after.requiredForAll, after.active]);
      await recordAudit(m, { actorUserId: actor.id, action: 'training_course.updated', entityType: 'training_course', entityId: id, before: { ...before }, after: { ...after }, requestId });
      return after;
    });
  }

  async function recordTraining(actor: SessionUser, input: RecordTrainingInput, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      await activePerson(m, input.userId);
      const today = await facilityToday(m);
      if (input.completedOn > today) throw new AppError('rule_violation', `A course cannot be recorded as completed after today (${today})`, 422, { today });
      // The default expiry is completion + the course's validity in months; PostgreSQL's date + interval keeps the day of
      // month and clamps to the month's last day (2026-01-31 + 1 month = 2026-02-28; PostgreSQL manual, date/time operators).
      const rows: { id: string; expires_on: string }[] = await m.query(
        `INSERT INTO training_records (user_id, course_id, completed_on, expires_on, note, recorded_by)
         SELECT $1, c.id, $3::date, COALESCE($4::date, ($3::date + make_interval(months => c.validity_months))::date), $5, $6
           FROM training_courses c WHERE c.id = $2 AND c.active
         RETURNING id, expires_on::text`, [input.userId, input.courseId, input.completedOn, input.expiresOn ?? null, input.note, actor.id]);
      if (!rows[0]) throw new AppError('invalid_course', 'That course does not exist or is no longer offered', 422, { courseId: input.courseId });
      await recordAudit(m, { actorUserId: actor.id, action: 'training.recorded', entityType: 'training_record', entityId: rows[0].id, after: { ...input, expiresOn: rows[0].expires_on }, requestId });
      return (await recordsOf(m, { id: rows[0].id }, today))[0]!;
    });
  }

  async function revokeTraining(actor: SessionUser, id: string, reason: string, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      const rows: { revoked_at: Date | null }[] = await m.query(`SELECT revoked_at FROM training_records WHERE id = $1 FOR UPDATE`, [id]);
      if (!rows[0]) throw notFound('Training record');
      if (rows[0].revoked_at) throw isRevoked('training record', rows[0].revoked_at);
      await m.query(`UPDATE training_records SET revoked_at = now(), revoked_by = $2, revoked_reason = $3 WHERE id = $1`, [id, actor.id, reason]);
      await recordAudit(m, { actorUserId: actor.id, action: 'training.revoked', entityType: 'training_record', entityId: id, after: { reason }, requestId });
      return (await recordsOf(m, { id }, await facilityToday(m)))[0]!;
    });
  }

  /** A new sign-off replaces the person's live one for that configuration (which is closed as revoked, with the reason). */
  async function grantSignoff(actor: SessionUser, input: GrantSignoffInput, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      await activePerson(m, input.userId);
      const config: { id: string }[] = await m.query(`SELECT id FROM configurations WHERE id = $1`, [input.configurationId]);
      if (!config[0]) throw new AppError('invalid_configuration', 'That configuration does not exist', 422, { configurationId: input.configurationId });
      const horizon: { ok: boolean }[] = await m.query(`SELECT $1::date <= $2::date + 366 AS ok`, [input.grantedOn, await facilityToday(m)]);
      if (!horizon[0]!.ok) throw new AppError('rule_violation', 'A sign-off can start at most a year ahead', 422, { grantedOn: input.grantedOn });
      // TypeORM answers an UPDATE … RETURNING with [rows, affected count].
      const [replaced] = (await m.query(
        `UPDATE configuration_signoffs SET revoked_at = now(), revoked_by = $3, revoked_reason = 'Replaced by a new sign-off'
          WHERE user_id = $1 AND configuration_id = $2 AND revoked_at IS NULL RETURNING id`, [input.userId, input.configurationId, actor.id])) as [{ id: string }[], number];
      for (const r of replaced) {
        await recordAudit(m, { actorUserId: actor.id, action: 'signoff.revoked', entityType: 'configuration_signoff', entityId: r.id, after: { reason: 'Replaced by a new sign-off' }, requestId });
      }
      const [row] = (await m.query(
        `INSERT INTO configuration_signoffs (user_id, configuration_id, granted_by, granted_on, expires_on, note) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
        [input.userId, input.configurationId, actor.id, input.grantedOn, input.expiresOn ?? null, input.note])) as { id: string }[];
      await recordAudit(m, { actorUserId: actor.id, action: 'signoff.granted', entityType: 'configuration_signoff', entityId: row!.id, after: { ...input }, requestId });
      return (await signoffsOf(m, { id: row!.id }, await facilityToday(m)))[0]!;
    });
  }

  async function revokeSignoff(actor: SessionUser, id: string, reason: string, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      const rows: { revoked_at: Date | null }[] = await m.query(`SELECT revoked_at FROM configuration_signoffs WHERE id = $1 FOR UPDATE`, [id]);
      if (!rows[0]) throw notFound('Sign-off');
      if (rows[0].revoked_at) throw isRevoked('sign-off', rows[0].revoked_at);
      await m.query(`UPDATE configuration_signoffs SET revoked_at = now(), revoked_by = $2, revoked_reason = $3 WHERE id = $1`, [id, actor.id, reason]);
      await recordAudit(m, { actorUserId: actor.id, action: 'signoff.revoked', entityType: 'configuration_signoff', entityId: id, after: { reason }, requestId });
      return (await signoffsOf(m, { id }, await facilityToday(m)))[0]!;
    });
  }

  /** Replaces a configuration's own courses and sign-off (the facility-wide courses apply regardless). */
  async function setRequirements(actor: SessionUser, configurationId: string, input: ConfigurationRequirementsInput, requestId?: string) {
    return db.transaction(async (m) => {
      await requireOfficer(m, actor);
      const before = (await requirementsOf(m, configurationId))[0];
      if (!before) throw notFound('Configuration');
      const courses: { id: string }[] = await m.query(`SELECT id FROM training_courses WHERE id = ANY($1::uuid[])`, [input.courseIds]);
      const unknown = input.courseIds.filter((id) => !courses.some((c) => c.id === id));
      if (unknown.length > 0) throw new AppError('invalid_course', 'Some of those courses do not exist', 422, { courseIds: unknown });
      await m.query(`DELETE FROM configuration_requirements WHERE configuration_id = $1`, [configurationId]);
      await m.query(`INSERT INTO configuration_requirements (configuration_id, course_id) SELECT $1, unnest($2::uuid[])`, [configurationId, [...new Set(input.courseIds)]]);
      if (input.signoffLabel) await m.query(`INSERT INTO configuration_requirements (configuration_id, signoff_label) VALUES ($1, $2)`, [configurationId, input.signoffLabel]);
      const after = (await requirementsOf(m, configurationId))[0]!;
      await recordAudit(m, { actorUserId: actor.id, action: 'configuration.requirements_updated', entityType: 'configuration', entityId: configurationId, before: { ...before }, after: { ...after }, requestId });
      return after;
    });
  }

  return { createCourse, updateCourse, recordTraining, revokeTraining, grantSignoff, revokeSignoff, setRequirements };
}
