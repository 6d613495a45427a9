import type { DataSource } from 'typeorm';
import { TrainingRecord } from '../modules/safety/training-record.entity';
import { baselineCourseId } from '../modules/training/training.queries';

/** The facility-wide laser-safety course every booking needs. */
export const laserSafetyCourseId = (db: DataSource) => baselineCourseId(db);

/** A Class 4 laser-safety record for the user: valid 2026-01-01 → 2028-01-01, or lapsed 2023 → 2025. */
export async function giveLaserSafetyTraining(db: DataSource, userId: string, valid = true): Promise<void> {
  await db.getRepository(TrainingRecord).insert({
    userId, courseId: await baselineCourseId(db),
    completedOn: valid ? '2026-01-01' : '2023-01-01', expiresOn: valid ? '2028-01-01' : '2025-01-01',
  });
}
