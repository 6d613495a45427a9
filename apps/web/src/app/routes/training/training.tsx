import { localDate } from '@femtoslot/shared';
import { useState } from 'react';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useCourses, useRequirements } from '../../../features/training/api/get-courses';
import { useMyTraining } from '../../../features/training/api/get-my-training';
import { usePersonTraining } from '../../../features/training/api/get-person-training';
import { CourseForm } from '../../../features/training/components/course-form';
import { PersonSearch } from '../../../features/training/components/person-search';
import { PersonTrainingPanel } from '../../../features/training/components/person-training-panel';
import { RequirementsEditor } from '../../../features/training/components/requirements-editor';
import { useSignedInUser } from '../../../lib/auth';

/** Everyone sees their own training here; staff and admin find anyone; the laser-safety officer records and revokes. */
export function TrainingPage() {
  const me = useSignedInUser();
  const facility = useFacility();
  const facilityWide = me.role === 'staff' || me.role === 'admin';
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const mine = useMyTraining();
  const other = usePersonTraining(facilityWide && selectedId && selectedId !== me.id ? selectedId : null);
  const shown = selectedId && selectedId !== me.id ? other : mine;
  const today = localDate(new Date(), facility.data?.timeZone ?? 'UTC');
  return (
    <>
      <PageHeader
        title="Training"
        lead={me.laserSafetyOfficer
          ? 'Record completed courses and grant or revoke configuration sign-offs. Every change is kept with your name in the audit trail.'
          : 'Your laser-safety courses and configuration sign-offs, and what each configuration asks of you. The facility’s laser-safety officer records them.'}
      />
      <div className="mb-5"><LaserCaution /></div>
      <div className={facilityWide ? 'grid gap-6 lg:grid-cols-[18rem_1fr]' : ''}>
        {facilityWide && <aside><PersonSearch selectedId={selectedId ?? me.id} onSelect={(p) => setSelectedId(p.id)} /></aside>}
        <div>
          {shown.isPending && <PageLoading label="Loading training" />}
          {shown.isError && <Notice tone="danger" title="Training could not be loaded">{shown.error.message}</Notice>}
          {shown.data && <PersonTrainingPanel data={shown.data} canEdit={me.laserSafetyOfficer} today={today} />}
        </div>
      </div>
      {me.laserSafetyOfficer && <CoursesSection />}
    </>
  );
}

/** The officer's list of courses and what each configuration asks for. */
function CoursesSection() {
  const courses = useCourses();
  const requirements = useRequirements();
  return (
    <details className="mt-8 space-y-3" data-testid="courses-section">
      <summary className="cursor-pointer text-lg font-bold">Courses and configuration requirements</summary>
      <div className="mt-3 space-y-4">
        <ul className="flex flex-wrap gap-2 text-sm">
          {(courses.data ?? []).map((c) => (
            <li key={c.id} className="rounded-lg border border-line bg-panel px-3 py-1.5">
              <span className="font-semibold">{c.name}</span> <span className="text-ink-muted">· {c.validityMonths} months{c.requiredForAll ? ' · everywhere' : ''}{c.active ? '' : ' · withdrawn'}</span>
            </li>
          ))}
        </ul>
        <CourseForm />
        {courses.data && requirements.data && <RequirementsEditor requirements={requirements.data} courses={courses.data} />}
      </div>
    </details>
  );
}
