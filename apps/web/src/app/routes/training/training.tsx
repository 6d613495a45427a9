import { localDate } from '@femtoslot/shared';
import { useState } from 'react';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useMyTraining } from '../../../features/training/api/get-my-training';
import { usePersonTraining } from '../../../features/training/api/get-person-training';
import { PersonSearch } from '../../../features/training/components/person-search';
import { PersonTrainingPanel } from '../../../features/training/components/person-training-panel';
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
    </>
  );
}
