import type { DataSource, EntityManager } from 'typeorm';
import { TrainingRecord } from '../modules/safety/training-record.entity';

/** The facility-wide laser-safety course (created by the training migration), made if a test database lacks it. */
export async function laserSafetyCourseId(db: DataSource | EntityManager): Promise<string> {
  const rows: { id: string }[] = await db.query(
    `INSERT INTO training_courses (name, validity_months, required_for_all) VALUES ('Class 4 laser safety', 24, true)
     ON CONFLICT ((lower(name))) DO UPDATE SET name = training_courses.name RETURNING id`);
  return rows[0]!.id;
}

/** A Class 4 laser-safety record for the user: valid 2026-01-01 → 2028-01-01, or lapsed 2023 → 2025. */
export async function giveLaserSafetyTraining(db: DataSource, userId: string, valid = true): Promise<void> {
  await db.getRepository(TrainingRecord).insert({
    userId, courseId: await laserSafetyCourseId(db),
    completedOn: valid ? '2026-01-01' : '2023-01-01', expiresOn: valid ? '2028-01-01' : '2025-01-01',
  });
}
