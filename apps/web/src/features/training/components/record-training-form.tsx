import type { CourseDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { useRecordTraining } from '../api/record-training';

/** The officer records a completed course; the expiry defaults to completion + the course's validity. */
export function RecordTrainingForm({ userId, courses, today }: { userId: string; courses: CourseDto[]; today: string }) {
  const active = courses.filter((c) => c.active);
  const [courseId, setCourseId] = useState(active[0]?.id ?? '');
  const [completedOn, setCompletedOn] = useState(today);
  const [expiresOn, setExpiresOn] = useState('');
  const [note, setNote] = useState('');
  const record = useRecordTraining();
  const course = active.find((c) => c.id === courseId);
  return (
    <form
      data-testid="record-training-form"
      className="grid gap-3 rounded-xl border border-line bg-panel p-4 sm:grid-cols-2"
      onSubmit={(event) => {
        event.preventDefault();
        record.mutate({ userId, courseId, completedOn, expiresOn: expiresOn || undefined, note }, {
          onSuccess: ({ record: saved }) => {
            toast.success(`${saved.courseName} recorded, valid until ${saved.expiresOn}`);
            setExpiresOn('');
            setNote('');
          },
        });
      }}
    >
      <p className="text-sm font-semibold sm:col-span-2">Record a completed course</p>
      <SelectField label="Course" name="courseId" value={courseId} onChange={(e) => setCourseId(e.target.value)}>
        {active.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
      </SelectField>
      <TextField label="Completed on" name="completedOn" type="date" max={today} required value={completedOn} onChange={(e) => setCompletedOn(e.target.value)} />
      <TextField label="Expires on" name="expiresOn" type="date" value={expiresOn} onChange={(e) => setExpiresOn(e.target.value)}
        hint={course ? `Leave empty for ${course.validityMonths} months after completion` : undefined} />
      <TextField label="Note" name="note" maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
      {record.error && <p className="text-sm font-semibold text-danger sm:col-span-2" role="alert">{record.error.message}</p>}
      <div className="sm:col-span-2"><Button type="submit" busy={record.isPending} disabled={!courseId} data-testid="record-training-submit">Record training</Button></div>
    </form>
  );
}
