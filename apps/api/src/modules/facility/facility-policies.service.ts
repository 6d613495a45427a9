import { facilityPolicySettingsSchema, type FacilityPoliciesPatch, type FacilityPolicySettings } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { recordAudit } from '../audit/audit.service';
import { FacilitySettings } from './facility-settings.entity';

/**
 * Applies a partial change of the facility policies and the session-log window in one transaction with its audit
 * event. The row is locked, the body checked field by field (unknown keys refused), then the merged whole is checked
 * again (cross-field rules such as shortest ≤ longest booking), so a change of one field cannot break another.
 * The facility_settings trigger bumps reference_revision in the same transaction: the next request reads the new rules.
 */
export async function updateFacilityPolicies(ctx: AppContext, patch: FacilityPoliciesPatch, actorUserId: string, requestId: string) {
  return ctx.db.transaction(async (m) => {
    const row = await m.getRepository(FacilitySettings).findOneOrFail({ where: { id: 1 }, lock: { mode: 'pessimistic_write' } });
    const before: FacilityPolicySettings = { ...row.policies, usageWindowMinutes: row.usageWindowMinutes };
    const { usageWindowMinutes, ...policies } = facilityPolicySettingsSchema.parse({ ...before, ...patch });
    await m.getRepository(FacilitySettings).update({ id: 1 }, { policies, usageWindowMinutes });
    const after = { ...policies, usageWindowMinutes };
    await recordAudit(m, { actorUserId, action: 'facility.policies_updated', entityType: 'facility', entityId: '1', before, after, requestId });
    return { name: row.name, timeZone: row.timeZone, currency: row.currency, policies, usageWindowMinutes };
  });
}
