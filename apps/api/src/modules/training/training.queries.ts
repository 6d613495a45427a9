import type {
  ConfigurationRequirementsDto, CourseDto, HoldingState, PersonTrainingDto, SignoffDto, TrainingPersonDto, TrainingRecordDto,
} from '@femtoslot/shared';
import type { DataSource, EntityManager } from 'typeorm';
import { notFound } from '../../lib/errors/app-error';
import { authorisationFor } from './authorisation';

type Db = DataSource | EntityManager;

/** The facility's today (its own zone), computed by PostgreSQL so that every query agrees with it. */
export async function facilityToday(db: Db): Promise<string> {
  const rows: { today: string }[] = await db.query(`SELECT (now() AT TIME ZONE f.time_zone)::date::text AS today FROM facility_settings f WHERE f.id = 1`);
  return rows[0]?.today ?? new Date().toISOString().slice(0, 10);
}

/** The facility-wide laser-safety course; the training migration creates it, this makes sure of it. */
export async function baselineCourseId(db: Db): Promise<string> {
  const rows: { id: string }[] = await db.query(
    `INSERT INTO training_courses (name, description, validity_months, required_for_all)
     VALUES ('Class 4 laser safety', 'Facility laser-safety induction for Class 4 sources', 24, true)
     ON CONFLICT ((lower(name))) DO UPDATE SET name = training_courses.name RETURNING id`);
  return rows[0]!.id;
}

function stateOf(today: string, from: string, until: string | null, revokedAt: unknown): HoldingState {
  if (revokedAt) return 'revoked';
  if (from > today) return 'not_yet_valid';
  return until !== null && until < today ? 'expired' : 'valid';
}

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

export async function listCourses(db: Db): Promise<CourseDto[]> {
  const rows: { id: string; name: string; description: string; validity_months: number; required_for_all: boolean; active: boolean }[] =
    await db.query(`SELECT id, name, description, validity_months, required_for_all, active FROM training_courses ORDER BY NOT required_for_all, lower(name)`);
  return rows.map((r) => ({ id: r.id, name: r.name, description: r.description, validityMonths: r.validity_months, requiredForAll: r.required_for_all, active: r.active }));
}

export async function recordsOf(db: Db, where: { userId?: string; id?: string }, today: string): Promise<TrainingRecordDto[]> {
  const rows: Record<string, string | null>[] = await db.query(
    `SELECT t.id, t.user_id, t.course_id, c.name AS course_name, t.completed_on::text, t.expires_on::text, t.note,
            rb.name AS recorded_by_name, t.revoked_at, vb.name AS revoked_by_name, t.revoked_reason
       FROM training_records t JOIN training_courses c ON c.id = t.course_id
       LEFT JOIN users rb ON rb.id = t.recorded_by LEFT JOIN users vb ON vb.id = t.revoked_by
      WHERE ($1::uuid IS NULL OR t.user_id = $1) AND ($2::uuid IS NULL OR t.id = $2)
      ORDER BY (t.revoked_at IS NOT NULL), t.expires_on DESC, lower(c.name)`, [where.userId ?? null, where.id ?? null]);
  return rows.map((r) => ({
    id: r.id!, userId: r.user_id!, courseId: r.course_id!, courseName: r.course_name!, completedOn: r.completed_on!, expiresOn: r.expires_on!,
    note: r.note ?? '', recordedByName: r.recorded_by_name, revokedAt: iso(r.revoked_at), revokedByName: r.revoked_by_name, revokedReason: r.revoked_reason,
    state: stateOf(today, r.completed_on!, r.expires_on!, r.revoked_at),
  }));
}

export async function signoffsOf(db: Db, where: { userId?: string; id?: string }, today: string): Promise<SignoffDto[]> {
  const rows: Record<string, string | null>[] = await db.query(
    `SELECT s.id, s.user_id, s.configuration_id, c.name AS configuration_name, i.name AS instrument_name, gb.name AS granted_by_name,
            s.granted_on::text, s.expires_on::text, s.note, s.revoked_at, vb.name AS revoked_by_name, s.revoked_reason
       FROM configuration_signoffs s JOIN configurations c ON c.id = s.configuration_id JOIN instruments i ON i.id = c.instrument_id
       JOIN users gb ON gb.id = s.granted_by LEFT JOIN users vb ON vb.id = s.revoked_by
      WHERE ($1::uuid IS NULL OR s.user_id = $1) AND ($2::uuid IS NULL OR s.id = $2)
      ORDER BY (s.revoked_at IS NOT NULL), s.granted_on DESC`, [where.userId ?? null, where.id ?? null]);
  return rows.map((r) => ({
    id: r.id!, userId: r.user_id!, configurationId: r.configuration_id!, configurationName: r.configuration_name!, instrumentName: r.instrument_name!,
    grantedByName: r.granted_by_name!, grantedOn: r.granted_on!, expiresOn: r.expires_on, note: r.note ?? '',
    revokedAt: iso(r.revoked_at), revokedByName: r.revoked_by_name, revokedReason: r.revoked_reason,
    state: stateOf(today, r.granted_on!, r.expires_on, r.revoked_at),
  }));
}

export async function requirementsOf(db: Db, configurationId?: string): Promise<ConfigurationRequirementsDto[]> {
  const rows: { configuration_id: string; configuration_name: string; instrument_name: string; courses: { id: string; name: string; requiredForAll: boolean }[]; signoff_label: string | null }[] = await db.query(
    `SELECT c.id AS configuration_id, c.name AS configuration_name, i.name AS instrument_name,
            COALESCE((SELECT json_agg(json_build_object('id', k.id, 'name', k.name, 'requiredForAll', k.required_for_all) ORDER BY NOT k.required_for_all, lower(k.name))
                        FROM training_courses k WHERE k.active AND (k.required_for_all OR EXISTS (
                          SELECT 1 FROM configuration_requirements r WHERE r.configuration_id = c.id AND r.course_id = k.id))), '[]') AS courses,
            (SELECT r.signoff_label FROM configuration_requirements r WHERE r.configuration_id = c.id AND r.signoff_label IS NOT NULL) AS signoff_label
       FROM configurations c JOIN instruments i ON i.id = c.instrument_id
      WHERE c.active AND ($1::uuid IS NULL OR c.id = $1)
      ORDER BY i.name, c.min_nm`, [configurationId ?? null]);
  return rows.map((r) => ({ configurationId: r.configuration_id, configurationName: r.configuration_name, instrumentName: r.instrument_name, courses: r.courses, signoffLabel: r.signoff_label }));
}

const personSql = `SELECT u.id, u.name, u.email, u.role, o.name AS organisation_name, u.is_laser_safety_officer
  FROM users u JOIN organisations o ON o.id = u.organisation_id`;
type PersonRow = { id: string; name: string; email: string; role: string; organisation_name: string; is_laser_safety_officer: boolean };
const toPerson = (r: PersonRow): TrainingPersonDto => ({ id: r.id, name: r.name, email: r.email, role: r.role, organisationName: r.organisation_name, laserSafetyOfficer: r.is_laser_safety_officer });

/** Active people whose name, e-mail or organisation contains the words typed (all of them), at most 50. */
export async function searchPeople(db: Db, q: string): Promise<TrainingPersonDto[]> {
  const words = q.split(/\s+/).filter(Boolean).slice(0, 5).map((w) => `%${w.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  const rows: PersonRow[] = await db.query(
    `${personSql} WHERE u.active AND NOT EXISTS (
       SELECT 1 FROM unnest($1::text[]) w WHERE NOT (u.name ILIKE w OR u.email ILIKE w OR o.name ILIKE w))
     ORDER BY lower(u.name) LIMIT 50`, [words]);
  return rows.map(toPerson);
}

export async function personTraining(db: Db, userId: string): Promise<PersonTrainingDto> {
  const rows: PersonRow[] = await db.query(`${personSql} WHERE u.id = $1`, [userId]);
  if (!rows[0]) throw notFound('Person');
  const today = await facilityToday(db);
  const configurations = await requirementsOf(db);
  const authorisations = [];
  for (const c of configurations) {
    const status = await authorisationFor(db, userId, c.configurationId, { from: today, to: today });
    authorisations.push({ ...status, configurationName: c.configurationName, instrumentName: c.instrumentName });
  }
  return { person: toPerson(rows[0]), records: await recordsOf(db, { userId }, today), signoffs: await signoffsOf(db, { userId }, today), authorisations };
}
