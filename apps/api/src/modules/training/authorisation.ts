import { localDate, type AuthorisationGap, type AuthorisationStatus } from '@femtoslot/shared';
import type { DataSource, EntityManager } from 'typeorm';

interface Row {
  kind: 'course' | 'signoff';
  course_id: string | null;
  name: string;
  valid: boolean;
  last_expiry: string | null;
  valid_from: string | null;
  revoked_at: Date | null;
  revoked_reason: string | null;
}

// $1 user, $2 configuration, $3 first day, $4 last day. A holding counts when it started on or before the first day,
// runs through the last day and is not revoked. For a gap, the reason comes from the holdings there are: a live one
// that ended before the last day (expired), one that starts after the first day (not yet valid), a revoked one, none.
const REQUIREMENTS_SQL = `
  WITH needed AS (
    SELECT c.id, c.name, c.required_for_all FROM training_courses c
     WHERE c.active AND (c.required_for_all OR EXISTS (
       SELECT 1 FROM configuration_requirements r WHERE r.configuration_id = $2 AND r.course_id = c.id))
  )
  SELECT * FROM (
    SELECT 'course' AS kind, n.id AS course_id, n.name,
      EXISTS (SELECT 1 FROM training_records t WHERE t.user_id = $1 AND t.course_id = n.id AND t.revoked_at IS NULL
                 AND t.completed_on <= $3 AND t.expires_on >= $4) AS valid,
      (SELECT max(t.expires_on)::text FROM training_records t WHERE t.user_id = $1 AND t.course_id = n.id
          AND t.revoked_at IS NULL AND t.completed_on <= $3) AS last_expiry,
      (SELECT min(t.completed_on)::text FROM training_records t WHERE t.user_id = $1 AND t.course_id = n.id
          AND t.revoked_at IS NULL AND t.completed_on > $3) AS valid_from,
      l.revoked_at, l.revoked_reason, NOT n.required_for_all AS own, n.name AS sort_name
    FROM needed n
    LEFT JOIN LATERAL (SELECT t.revoked_at, t.revoked_reason FROM training_records t
                        WHERE t.user_id = $1 AND t.course_id = n.id AND t.revoked_at IS NOT NULL
                        ORDER BY t.revoked_at DESC LIMIT 1) l ON true
    UNION ALL
    SELECT 'signoff', NULL, r.signoff_label,
      EXISTS (SELECT 1 FROM configuration_signoffs s WHERE s.user_id = $1 AND s.configuration_id = $2 AND s.revoked_at IS NULL
                 AND s.granted_on <= $3 AND (s.expires_on IS NULL OR s.expires_on >= $4)),
      (SELECT max(s.expires_on)::text FROM configuration_signoffs s WHERE s.user_id = $1 AND s.configuration_id = $2
          AND s.revoked_at IS NULL AND s.granted_on <= $3),
      (SELECT min(s.granted_on)::text FROM configuration_signoffs s WHERE s.user_id = $1 AND s.configuration_id = $2
          AND s.revoked_at IS NULL AND s.granted_on > $3),
      l.revoked_at, l.revoked_reason, true, '~'
    FROM configuration_requirements r
    LEFT JOIN LATERAL (SELECT s.revoked_at, s.revoked_reason FROM configuration_signoffs s
                        WHERE s.user_id = $1 AND s.configuration_id = $2 AND s.revoked_at IS NOT NULL
                        ORDER BY s.revoked_at DESC LIMIT 1) l ON true
    WHERE r.configuration_id = $2 AND r.signoff_label IS NOT NULL
  ) x ORDER BY own, sort_name`;

function gapOf(r: Row): AuthorisationGap {
  const reason: AuthorisationGap['reason'] = r.last_expiry ? 'expired' : r.valid_from ? 'not_yet_valid' : r.revoked_at ? 'revoked' : 'missing';
  return {
    kind: r.kind, name: r.name, courseId: r.course_id, reason,
    expiredOn: reason === 'expired' ? r.last_expiry : null,
    validFrom: reason === 'not_yet_valid' ? r.valid_from : null,
    revokedAt: reason === 'revoked' && r.revoked_at ? new Date(r.revoked_at).toISOString() : null,
    revokedReason: reason === 'revoked' ? r.revoked_reason : null,
  };
}

/** The session's first and last calendar days in the facility zone; the end instant itself is not in the session. */
export function sessionDays(startsAt: Date, endsAt: Date, timeZone: string): { from: string; to: string } {
  const last = new Date(Math.max(startsAt.getTime(), endsAt.getTime() - 1));
  return { from: localDate(startsAt, timeZone), to: localDate(last, timeZone) };
}

/**
 * What a person lacks to use a configuration on every day from `from` to `to` (facility dates): the facility-wide
 * courses, the configuration's own courses and its sign-off. The one rule the booking engine and the screens share.
 */
export async function authorisationFor(m: DataSource | EntityManager, userId: string, configurationId: string, days: { from: string; to: string }): Promise<AuthorisationStatus> {
  const rows: Row[] = await m.query(REQUIREMENTS_SQL, [userId, configurationId, days.from, days.to]);
  const gaps = rows.filter((r) => !r.valid).map(gapOf);
  return { configurationId, from: days.from, to: days.to, ok: gaps.length === 0, gaps };
}
