import type { PersonTrainingDto, SignoffDto, TrainingRecordDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { StatusPill } from '../../../components/ui/status-pill';
import { useCourses, useRequirements } from '../api/get-courses';
import { useRevokeSignoff } from '../api/revoke-signoff';
import { useRevokeTraining } from '../api/revoke-training';
import { AuthorisationSummary } from './authorisation-summary';
import { GrantSignoffForm } from './grant-signoff-form';
import { RecordTrainingForm } from './record-training-form';
import { RevokeDialog } from './revoke-dialog';
import { SignoffsTable } from './signoffs-table';
import { TrainingRecordsTable } from './training-records-table';

type Revoking = { kind: 'record'; item: TrainingRecordDto } | { kind: 'signoff'; item: SignoffDto } | null;

/** One person's courses, sign-offs and what each configuration needs; the officer also records and revokes here. */
export function PersonTrainingPanel({ data, canEdit, today }: { data: PersonTrainingDto; canEdit: boolean; today: string }) {
  const courses = useCourses();
  const requirements = useRequirements();
  const revokeRecord = useRevokeTraining();
  const revokeSignoff = useRevokeSignoff();
  const [revoking, setRevoking] = useState<Revoking>(null);
  const pending = revokeRecord.isPending || revokeSignoff.isPending;
  const error = (revoking?.kind === 'record' ? revokeRecord.error : revokeSignoff.error)?.message;
  const confirm = (reason: string) => {
    if (!revoking) return;
    const done = { onSuccess: () => { toast.success('Revoked'); setRevoking(null); } };
    if (revoking.kind === 'record') revokeRecord.mutate({ id: revoking.item.id, reason }, done);
    else revokeSignoff.mutate({ id: revoking.item.id, reason }, done);
  };
  return (
    <section className="space-y-5" data-testid="person-training" data-person-id={data.person.id}>
      <header className="flex flex-wrap items-center gap-2">
        <h2 className="text-lg font-bold">{data.person.name}</h2>
        <span className="text-sm text-ink-muted">{data.person.email} · {data.person.organisationName}</span>
        {data.person.laserSafetyOfficer && <StatusPill tone="accent">Laser-safety officer</StatusPill>}
      </header>
      <div className="space-y-2">
        <h3 className="text-sm font-semibold">Configurations today</h3>
        <AuthorisationSummary authorisations={data.authorisations} />
      </div>
      <div className="space-y-2">
        <h3 className="text-sm font-semibold">Courses</h3>
        <TrainingRecordsTable records={data.records} onRevoke={canEdit ? (item) => setRevoking({ kind: 'record', item }) : undefined} />
      </div>
      <div className="space-y-2">
        <h3 className="text-sm font-semibold">Sign-offs</h3>
        <SignoffsTable signoffs={data.signoffs} onRevoke={canEdit ? (item) => setRevoking({ kind: 'signoff', item }) : undefined} />
      </div>
      {canEdit && courses.data && requirements.data && (
        <div className="grid gap-4 lg:grid-cols-2">
          <RecordTrainingForm key={`r-${data.person.id}`} userId={data.person.id} courses={courses.data} today={today} />
          <GrantSignoffForm key={`s-${data.person.id}`} userId={data.person.id} requirements={requirements.data} today={today} />
        </div>
      )}
      <RevokeDialog
        key={revoking?.item.id ?? 'none'}
        what={revoking?.kind === 'record' ? `“${revoking.item.courseName}”` : revoking ? `the ${revoking.item.configurationName} sign-off` : ''}
        open={revoking !== null}
        busy={pending}
        error={error}
        onClose={() => setRevoking(null)}
        onConfirm={confirm}
      />
    </section>
  );
}
