import type { ConfigurationRequirementsDto, CourseDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { useSaveRequirements } from '../api/save-requirements';

/** One configuration's own courses and sign-off; facility-wide courses apply regardless and are shown, not chosen. */
function RequirementRow({ row, courses }: { row: ConfigurationRequirementsDto; courses: CourseDto[] }) {
  const own = courses.filter((c) => c.active && !c.requiredForAll);
  const [chosen, setChosen] = useState(() => new Set(row.courses.filter((c) => !c.requiredForAll).map((c) => c.id)));
  const [label, setLabel] = useState(row.signoffLabel ?? '');
  const save = useSaveRequirements();
  return (
    <li className="space-y-2 px-4 py-3" data-testid="requirement-row" data-configuration-id={row.configurationId}>
      <p className="text-sm font-semibold">{row.configurationName} <span className="font-normal text-ink-muted">· {row.instrumentName}</span></p>
      <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        {courses.filter((c) => c.active && c.requiredForAll).map((c) => <span key={c.id} className="text-ink-muted">{c.name} (everywhere)</span>)}
        {own.map((c) => (
          <label key={c.id} className="inline-flex items-center gap-1.5">
            <input
              type="checkbox"
              checked={chosen.has(c.id)}
              onChange={(e) => setChosen((prev) => { const next = new Set(prev); if (e.target.checked) next.add(c.id); else next.delete(c.id); return next; })}
            />
            {c.name}
          </label>
        ))}
      </div>
      <div className="flex flex-wrap items-end gap-2">
        <div className="min-w-72 flex-1">
          <TextField label="Sign-off needed (empty for none)" name="signoffLabel" maxLength={200} placeholder="e.g. only after a supervised session" value={label} onChange={(e) => setLabel(e.target.value)} />
        </div>
        <Button
          variant="secondary"
          busy={save.isPending}
          onClick={() => save.mutate({ configurationId: row.configurationId, input: { courseIds: [...chosen], signoffLabel: label.trim() || null } }, {
            onSuccess: () => toast.success(`Requirements for ${row.configurationName} saved`),
            onError: (error) => toast.error(error.message),
          })}
        >
          Save
        </Button>
      </div>
    </li>
  );
}

export function RequirementsEditor({ requirements, courses }: { requirements: ConfigurationRequirementsDto[]; courses: CourseDto[] }) {
  return (
    <ul className="divide-y divide-line rounded-xl border border-line bg-panel" data-testid="requirements-editor">
      {requirements.map((r) => <RequirementRow key={r.configurationId} row={r} courses={courses} />)}
    </ul>
  );
}
