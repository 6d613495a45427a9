import type { LeftOutSession } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';

/**
 * Bookings that start in the month and are not on the statement: approved or completed ones with no log or a log
 * staff have not confirmed, and requests still waiting for approval. Cancelled and displaced bookings are billed by
 * their own lines (fee or zero), and a billed log was billed in an earlier period.
 */
export async function leftOutSessions(m: EntityManager, bounds: { startsAt: Date; endsAt: Date }): Promise<LeftOutSession[]> {
  const rows: (Omit<LeftOutSession, 'startsAt' | 'endsAt'> & { startsAt: Date; endsAt: Date })[] = await m.query(
    `SELECT b.id AS "bookingId", b.status AS "bookingStatus", u.id AS "usageLogId", b.starts_at AS "startsAt", b.ends_at AS "endsAt",
            CASE WHEN b.status = 'requested' THEN 'not_approved' WHEN u.id IS NULL THEN 'unlogged' ELSE 'log_not_confirmed' END AS reason,
            i.name AS "instrumentName", c.name AS "configurationName", p.id AS "userId", p.name AS "userName", p.email AS "userEmail",
            a.id AS "accountId", a.name AS "accountName", o.name AS "organisationName"
       FROM timeline_blocks b
       JOIN instruments i ON i.id = b.instrument_id
       LEFT JOIN configurations c ON c.id = b.configuration_id
       LEFT JOIN usage_logs u ON u.booking_id = b.id
       LEFT JOIN users p ON p.id = b.user_id
       LEFT JOIN accounts a ON a.id = b.account_id
       LEFT JOIN organisations o ON o.id = b.organisation_id
      WHERE b.kind = 'booking' AND b.starts_at >= $1 AND b.starts_at < $2
        AND (b.status = 'requested' OR (b.status IN ('approved', 'completed') AND (u.id IS NULL OR u.status = 'submitted')))
      ORDER BY b.starts_at, b.id`, [bounds.startsAt, bounds.endsAt]);
  return rows.map((r) => ({ ...r, startsAt: new Date(r.startsAt).toISOString(), endsAt: new Date(r.endsAt).toISOString() }));
}
