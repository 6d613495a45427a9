import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Working hours as a facility policy (08:00–18:00, Monday to Friday, facility zone), written into existing settings
 * so that staff see the value in use; slots offered to displaced bookings prefer them.
 */
export class FacilityWorkingHours1765600000000 implements MigrationInterface {
  name = 'FacilityWorkingHours1765600000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE facility_settings SET policies = policies || '{"workingHours":{"start":"08:00","end":"18:00","weekdays":[1,2,3,4,5]}}'::jsonb WHERE NOT policies ? 'workingHours'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE facility_settings SET policies = policies - 'workingHours'`);
  }
}
