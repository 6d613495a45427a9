import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { useCreateCourse } from '../api/create-course';

export function CourseForm() {
  const [name, setName] = useState('');
  const [validityMonths, setValidityMonths] = useState('24');
  const [description, setDescription] = useState('');
  const [requiredForAll, setRequiredForAll] = useState(false);
  const create = useCreateCourse();
  return (
    <form
      data-testid="course-form"
      className="grid gap-3 rounded-xl border border-line bg-panel p-4 sm:grid-cols-2"
      onSubmit={(event) => {
        event.preventDefault();
        create.mutate({ name, description, validityMonths: Number(validityMonths), requiredForAll, active: true }, {
          onSuccess: ({ course }) => {
            toast.success(`Course “${course.name}” added`);
            setName('');
            setDescription('');
          },
        });
      }}
    >
      <p className="text-sm font-semibold sm:col-span-2">Add a course</p>
      <TextField label="Name" name="courseName" required minLength={2} maxLength={120} value={name} onChange={(e) => setName(e.target.value)} />
      <TextField label="Valid for (months)" name="validityMonths" type="number" min={1} max={120} required value={validityMonths} onChange={(e) => setValidityMonths(e.target.value)} />
      <TextField label="Description" name="description" maxLength={1000} value={description} onChange={(e) => setDescription(e.target.value)} />
      <label className="flex items-center gap-2 self-end pb-2 text-sm">
        <input type="checkbox" name="requiredForAll" checked={requiredForAll} onChange={(e) => setRequiredForAll(e.target.checked)} />
        Required for every configuration
      </label>
      {create.error && <p className="text-sm font-semibold text-danger sm:col-span-2" role="alert">{create.error.message}</p>}
      <div className="sm:col-span-2"><Button type="submit" busy={create.isPending}>Add course</Button></div>
    </form>
  );
}
