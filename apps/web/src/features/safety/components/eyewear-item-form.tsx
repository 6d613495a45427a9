import { eyewearBandSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import type { EyewearItem } from '../api/get-eyewear';
import { useSaveEyewear } from '../api/save-eyewear';

const formSchema = z.object({
  label: z.string().trim().min(1, 'Give the eyewear a label').max(120),
  description: z.string().trim().max(500),
  bands: z.array(eyewearBandSchema).min(1, 'Add at least one band'),
});
type FormValues = z.infer<typeof formSchema>;

export function EyewearItemForm({ item, onDone }: { item: EyewearItem | null; onDone: () => void }) {
  const save = useSaveEyewear();
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: item
      ? { label: item.label, description: item.description, bands: item.bands }
      : { label: '', description: '', bands: [{ minNm: 190, maxNm: 400, od: 5 }] },
  });
  const bands = useFieldArray({ control: form.control, name: 'bands' });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit((input) =>
    save.mutate(item ? { id: item.id, input } : { input }, {
      onSuccess: () => (toast.success(item ? 'Eyewear updated' : 'Eyewear added'), onDone()),
      onError: (e) => toast.error(e.message),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-lg border border-line bg-sunk/50 p-3" data-testid="eyewear-form">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Label" error={errors.label?.message} {...form.register('label')} />
        <TextField label="Description" error={errors.description?.message} {...form.register('description')} />
      </div>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Bands (nm) and optical density</legend>
        {bands.fields.map((field, index) => (
          <div key={field.id} className="grid grid-cols-[1fr_1fr_6rem_auto] items-end gap-2" data-testid="eyewear-band">
            <TextField label="From nm" type="number" step="any" error={errors.bands?.[index]?.minNm?.message ?? errors.bands?.[index]?.message} {...form.register(`bands.${index}.minNm`, { valueAsNumber: true })} />
            <TextField label="To nm" type="number" step="any" error={errors.bands?.[index]?.maxNm?.message} {...form.register(`bands.${index}.maxNm`, { valueAsNumber: true })} />
            <TextField label="OD" type="number" step="0.5" error={errors.bands?.[index]?.od?.message} {...form.register(`bands.${index}.od`, { valueAsNumber: true })} />
            <Button variant="quiet" size="sm" aria-label={`Remove band ${index + 1}`} disabled={bands.fields.length === 1} onClick={() => bands.remove(index)}>
              Remove
            </Button>
          </div>
        ))}
        {errors.bands?.root?.message && <p className="text-xs font-semibold text-danger">{errors.bands.root.message}</p>}
        <Button variant="secondary" size="sm" data-testid="add-band" onClick={() => bands.append({ minNm: 800, maxNm: 1100, od: 5 })}>
          Add band
        </Button>
      </fieldset>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" size="sm" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" size="sm" busy={save.isPending} data-testid="save-eyewear">
          {item ? 'Save' : 'Add eyewear'}
        </Button>
      </div>
    </form>
  );
}
