import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { useDeleteEyewear } from '../api/delete-eyewear';
import { type EyewearItem, useEyewear } from '../api/get-eyewear';
import { useSaveEyewear } from '../api/save-eyewear';
import { EyewearItemForm } from './eyewear-item-form';

const nm = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

/** The eyewear on the facility's shelf; the request form offers the items that cover the whole table. */
export function EyewearEditor() {
  const eyewear = useEyewear();
  const [editing, setEditing] = useState<string | 'new' | null>(null);
  const items = eyewear.data ?? [];
  return (
    <section className="rounded-xl border border-line bg-panel px-4 py-4" data-testid="eyewear-editor" aria-labelledby="eyewear-title">
      <div className="flex items-start justify-between gap-3">
        <div>
          <h2 id="eyewear-title" className="font-semibold">
            Laser-safety eyewear
          </h2>
          <p className="text-sm text-ink-muted">Each item's rated bands and OD, as printed on the eyewear. Deactivated items are no longer offered.</p>
        </div>
        <Button size="sm" data-testid="new-eyewear" onClick={() => setEditing('new')} disabled={editing === 'new'}>
          Add eyewear
        </Button>
      </div>
      {eyewear.isError && <p className="mt-2 text-sm text-danger">{eyewear.error.message}</p>}
      <div className="mt-3 space-y-3">
        {editing === 'new' && <EyewearItemForm item={null} onDone={() => setEditing(null)} />}
        {items.map((item) =>
          editing === item.id ? (
            <EyewearItemForm key={item.id} item={item} onDone={() => setEditing(null)} />
          ) : (
            <EyewearRow key={item.id} item={item} onEdit={() => setEditing(item.id)} />
          ),
        )}
        {eyewear.isSuccess && items.length === 0 && editing !== 'new' && <p className="text-sm text-ink-muted">No eyewear on the list yet.</p>}
      </div>
    </section>
  );
}

function EyewearRow({ item, onEdit }: { item: EyewearItem; onEdit: () => void }) {
  const save = useSaveEyewear();
  const remove = useDeleteEyewear();
  return (
    <div className="flex flex-wrap items-start justify-between gap-3 rounded-lg border border-line px-3 py-2.5" data-testid="eyewear-item" data-active={item.active}>
      <div className="min-w-0 text-sm">
        <p className="font-semibold">
          {item.label} {!item.active && <span className="ml-1 rounded bg-sunk px-1.5 text-xs font-semibold text-ink-muted">inactive</span>}
        </p>
        {item.description && <p className="text-ink-muted">{item.description}</p>}
        <p className="mt-1 tabular-nums text-ink-muted">
          {item.bands.map((b) => `${nm.format(b.minNm)}–${nm.format(b.maxNm)} nm OD ${b.od}`).join(' · ')}
        </p>
      </div>
      <div className="flex gap-1.5">
        <Button size="sm" variant="secondary" onClick={onEdit}>
          Edit
        </Button>
        <Button
          size="sm"
          variant="secondary"
          busy={save.isPending}
          data-testid="toggle-eyewear-active"
          onClick={() => save.mutate({ id: item.id, input: { active: !item.active } }, { onError: (e) => toast.error(e.message) })}
        >
          {item.active ? 'Deactivate' : 'Reactivate'}
        </Button>
        <Button
          size="sm"
          variant="danger"
          busy={remove.isPending}
          onClick={() => remove.mutate(item.id, { onSuccess: () => toast.success('Eyewear removed'), onError: (e) => toast.error(e.message) })}
        >
          Delete
        </Button>
      </div>
    </div>
  );
}
