import type { TrainingPersonDto } from '@femtoslot/shared';
import { useDeferredValue, useState } from 'react';
import { TextField } from '../../../components/ui/field';
import { cx } from '../../../lib/cx';
import { usePeopleSearch } from '../api/search-people';

/** Find a person by name, e-mail or organisation (staff and admin). */
export function PersonSearch({ selectedId, onSelect }: { selectedId: string | null; onSelect: (person: TrainingPersonDto) => void }) {
  const [q, setQ] = useState('');
  const deferred = useDeferredValue(q.trim());
  const people = usePeopleSearch(deferred, true);
  return (
    <div className="space-y-3">
      <TextField label="Find a person" name="q" type="search" placeholder="Name, e-mail or organisation" value={q} onChange={(e) => setQ(e.target.value)} />
      {people.isError && <p className="text-sm text-danger" role="alert">{people.error.message}</p>}
      <ul className="max-h-[28rem] divide-y divide-line overflow-y-auto rounded-xl border border-line bg-panel" data-testid="people-results">
        {(people.data ?? []).map((p) => (
          <li key={p.id}>
            <button
              type="button"
              data-testid="person-result"
              data-person-id={p.id}
              onClick={() => onSelect(p)}
              className={cx('w-full px-3 py-2 text-left text-sm hover:bg-sunk', p.id === selectedId && 'bg-accent-soft')}
            >
              <span className="block font-semibold">{p.name}</span>
              <span className="block text-xs text-ink-muted">{p.email} · {p.organisationName}</span>
            </button>
          </li>
        ))}
        {people.data?.length === 0 && <li className="px-3 py-4 text-center text-sm text-ink-muted">Nobody matches.</li>}
      </ul>
    </div>
  );
}
