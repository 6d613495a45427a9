import { localDate } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { layout, type RenderedMail } from '../../lib/mail/templates';

export const TRAINING_REMINDER_QUEUE = 'training-expiry-reminders';
/** Every morning at 06:00 in the facility's zone. */
export const TRAINING_REMINDER_CRON = '0 6 * * *';
export const DEFAULT_TRAINING_REMINDER_DAYS = 30;

interface Due {
  id: string;
  email: string;
  name: string;
  what: string;
  expires_on: string;
}

function reminderMail(p: { name: string; kind: 'course' | 'signoff'; what: string; expiresOn: string; days: number; url: string }): RenderedMail {
  const thing = p.kind === 'course' ? `your training "${p.what}"` : `your sign-off for ${p.what}`;
  const lines = [
    `Hello ${p.name},`,
    `${thing[0]!.toUpperCase()}${thing.slice(1)} expires on ${p.expiresOn} (in ${p.days} day${p.days === 1 ? '' : 's'}).`,
    'After that date Femtoslot will refuse beam time on the configurations that require it. Please arrange a renewal with the facility’s laser-safety officer.',
  ];
  return {
    template: p.kind === 'course' ? 'training_expiry' : 'signoff_expiry',
    subject: p.kind === 'course' ? `Your laser training "${p.what}" expires on ${p.expiresOn}` : `Your sign-off for ${p.what} expires on ${p.expiresOn}`,
    text: `${lines.join('\n\n')}\n\n${p.url}\n`,
    html: layout('Training about to expire', lines, { label: 'See my training', url: p.url }),
  };
}

const daysBetween = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);

/**
 * Marks what expires within the reminder window and queues one e-mail each, in one transaction. The marker is set by
 * the same UPDATE that picks the rows (`reminder_sent_at IS NULL`), so a re-run, or two processes at once, never send
 * twice: the second waits on the row lock and then finds the marker set. A record that was renewed (a later one for
 * the same course) is not reminded.
 */
export async function sendTrainingReminders(ctx: AppContext, now = new Date()): Promise<{ queued: number }> {
  return ctx.db.transaction(async (m: EntityManager) => {
    const [facility] = (await m.query(`SELECT time_zone, policies FROM facility_settings WHERE id = 1`)) as { time_zone: string; policies: { trainingReminderDays?: number } }[];
    if (!facility) return { queued: 0 };
    const window = facility.policies.trainingReminderDays ?? DEFAULT_TRAINING_REMINDER_DAYS;
    const today = localDate(now, facility.time_zone);
    // TypeORM answers an UPDATE … RETURNING with [rows, affected count].
    const [courses] = (await m.query(
      `UPDATE training_records t SET reminder_sent_at = $3 FROM users u, training_courses c
        WHERE u.id = t.user_id AND c.id = t.course_id AND u.active AND t.revoked_at IS NULL AND t.reminder_sent_at IS NULL
          AND t.expires_on >= $1::date AND t.expires_on <= $1::date + $2::int
          AND NOT EXISTS (SELECT 1 FROM training_records n WHERE n.user_id = t.user_id AND n.course_id = t.course_id
                            AND n.revoked_at IS NULL AND n.expires_on > t.expires_on)
        RETURNING t.id, u.email, u.name, c.name AS what, t.expires_on::text`, [today, window, now])) as [Due[], number];
    const [signoffs] = (await m.query(
      `UPDATE configuration_signoffs s SET reminder_sent_at = $3 FROM users u, configurations c, instruments i
        WHERE u.id = s.user_id AND c.id = s.configuration_id AND i.id = c.instrument_id AND u.active AND s.revoked_at IS NULL
          AND s.reminder_sent_at IS NULL AND s.expires_on IS NOT NULL AND s.expires_on >= $1::date AND s.expires_on <= $1::date + $2::int
        RETURNING s.id, u.email, u.name, c.name || ' on ' || i.name AS what, s.expires_on::text`, [today, window, now])) as [Due[], number];
    const url = `${ctx.env.APP_URL}/training`;
    for (const [kind, rows] of [['course', courses], ['signoff', signoffs]] as const) {
      for (const r of rows) {
        await ctx.outbox.enqueue(m, r.email, reminderMail({ name: r.name, kind, what: r.what, expiresOn: r.expires_on, days: daysBetween(today, r.expires_on), url }));
      }
    }
    return { queued: courses.length + signoffs.length };
  });
}

/** The daily run, scheduled in the facility's zone (re-declared at each start, so a changed zone applies after a restart). */
export async function startTrainingJobs(ctx: AppContext): Promise<void> {
  await ctx.outbox.work(TRAINING_REMINDER_QUEUE, async () => { await sendTrainingReminders(ctx); });
  const rows: { time_zone: string }[] = await ctx.db.query(`SELECT time_zone FROM facility_settings WHERE id = 1`);
  await ctx.outbox.schedule(TRAINING_REMINDER_QUEUE, TRAINING_REMINDER_CRON, rows[0]?.time_zone ?? 'UTC');
}
