import type { EntityManager } from 'typeorm';
import { demoUsers } from './demo-data';
import { baselineCourseId } from '../../modules/training/training.queries';

const addDays = (isoDate: string, days: number) => {
  const d = new Date(`${isoDate}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

/**
 * Invented demo training: the facility-wide Class 4 course for everyone (lapsed for two), a mid-IR course and a
 * supervised-session sign-off that the DFG configuration asks for, the staff scientist as laser-safety officer, one
 * DFG sign-off (the academic collaborator), one record about to expire so that the daily reminder has something to say.
 */
export async function seedTraining(m: EntityManager, today: string): Promise<void> {
  const userId = async (email: string) => ((await m.query(`SELECT id FROM users WHERE email = $1`, [email])) as { id: string }[])[0]!.id;
  const officer = await userId('staff@harrowpoint.test');
  await m.query(`UPDATE users SET is_laser_safety_officer = true WHERE id = $1`, [officer]);
  const classFour = await baselineCourseId(m);
  const course = async (name: string, description: string, months: number) => ((await m.query(
    `INSERT INTO training_courses (name, description, validity_months) VALUES ($1, $2, $3) RETURNING id`, [name, description, months])) as { id: string }[])[0]!.id;
  const midIr = await course('Mid-infrared beam handling', 'Invisible mid-IR beams: beam finding with cards and cameras, enclosures, DFG crystal hazards', 24);
  await course('Nonlinear crystal care', 'Handling, cleaning and storing BBO, KTA and AgGaS₂ crystals', 36);

  const [dfg] = (await m.query(`SELECT c.id FROM configurations c JOIN instruments i ON i.id = c.instrument_id WHERE i.name = 'Aurora line' AND c.key = 'dfg'`)) as { id: string }[];
  await m.query(`INSERT INTO configuration_requirements (configuration_id, course_id) VALUES ($1, $2)`, [dfg!.id, midIr]);
  await m.query(`INSERT INTO configuration_requirements (configuration_id, signoff_label) VALUES ($1, $2)`, [dfg!.id, 'DFG mid-IR only after a supervised session with the laser-safety officer']);

  const record = (user: string, courseId: string, completedOn: string, expiresOn: string) => m.query(
    `INSERT INTO training_records (user_id, course_id, completed_on, expires_on, recorded_by) VALUES ($1, $2, $3, $4, $5)`, [user, courseId, completedOn, expiresOn, officer]);
  for (const u of demoUsers) {
    const completedOn = u.trainingValid ? addDays(today, -200) : addDays(today, -800);
    await record(await userId(u.email), classFour, completedOn, addDays(completedOn, 730));
  }
  const collaborator = await userId('collaborator@harrowpoint.test');
  await record(collaborator, midIr, addDays(today, -90), addDays(today, 640));
  await record(await userId('member@harrowpoint.test'), midIr, addDays(today, -30), addDays(today, 700));
  await record(await userId('sensors@sedgeline.test'), midIr, addDays(today, -710), addDays(today, 20));
  await m.query(`INSERT INTO configuration_signoffs (user_id, configuration_id, granted_by, granted_on, note) VALUES ($1, $2, $3, $4, $5)`,
    [collaborator, dfg!.id, officer, addDays(today, -80), 'Supervised DFG alignment session completed']);
}
