import { zodResolver } from '@hookform/resolvers/zod';
import { type Path, useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { isApiError } from '../../../lib/api-client';
import { applyApiFieldErrors } from '../../../lib/form-errors';
import { minorUnitExponent } from '../../../lib/money';
import { useCreateRateCard } from '../api/create-rate-card';
import type { RateCard } from '../api/get-rate-cards';
import { type RateCardFormValues, categories, categoryLabels, rateCardFormDefaults, rateCardFormSchema, rateClassLabels, rateClassesShown } from '../lib/rate-card-form-values';

const topFields = ['name', 'effectiveFrom', 'effectiveTo', 'billingIncrementMinutes', 'changeoverSharePercent', 'minimumChargeMinutes'] as const;
const rateFields = categories.flatMap((c) => rateClassesShown.map((k) => `rates.${c}.${k}` as Path<RateCardFormValues>));

export interface RateCardFormProps {
  currency: string;
  latest: RateCard | undefined;
  /** YYYY-MM-DD in the facility zone */
  defaultEffectiveFrom: string;
  onDone?: () => void;
}

/** A new rate card; amounts typed in major units per hour and sent as exact minor units. */
export function RateCardForm({ currency, latest, defaultEffectiveFrom, onDone }: RateCardFormProps) {
  const create = useCreateRateCard();
  const form = useForm<RateCardFormValues, unknown, z.output<ReturnType<typeof rateCardFormSchema>>>({
    resolver: zodResolver(rateCardFormSchema(currency)),
    defaultValues: rateCardFormDefaults(latest, currency, defaultEffectiveFrom),
  });
  const { errors } = form.formState;
  const exponent = minorUnitExponent(currency);
  const placeholder = exponent ? `0.${'0'.repeat(exponent)}` : '0';

  const onSubmit = form.handleSubmit((input) =>
    create.mutate(input, {
      onSuccess: (card) => {
        toast.success(`Rate card "${card.name}" saved`);
        form.reset(rateCardFormDefaults(card, currency, defaultEffectiveFrom));
        onDone?.();
      },
      onError: (error) => {
        if (applyApiFieldErrors(error, form.setError, [...topFields, ...rateFields])) return;
        if (isApiError(error) && error.status === 409) toast.error('Its dates overlap another rate card. Pick dates that follow the existing cards.');
        else toast.error(error.message);
      },
    }),
  );

  return (
    <form data-testid="rate-card-form" onSubmit={onSubmit} noValidate className="space-y-4 rounded-xl border border-line bg-panel p-4">
      <h3 className="font-semibold">Add a rate card</h3>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField label="Name" error={errors.name?.message} {...form.register('name')} />
        <TextField label="Effective from" type="date" error={errors.effectiveFrom?.message} {...form.register('effectiveFrom')} />
        <TextField label="Effective until" type="date" hint="Optional; exclusive. Empty: until a later card." error={errors.effectiveTo?.message} {...form.register('effectiveTo')} />
        <TextField label="Billing increment (min)" inputMode="numeric" error={errors.billingIncrementMinutes?.message} {...form.register('billingIncrementMinutes')} />
        <TextField label="Changeover charged (%)" inputMode="numeric" hint="Share of the changeover time charged to the incoming booking." error={errors.changeoverSharePercent?.message} {...form.register('changeoverSharePercent')} />
        <TextField label="Minimum charge (min)" inputMode="numeric" error={errors.minimumChargeMinutes?.message} {...form.register('minimumChargeMinutes')} />
      </div>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Rates per hour ({currency})</legend>
        <div className="grid gap-3 sm:grid-cols-[auto_1fr_1fr] sm:items-start">
          <span className="hidden sm:block" />
          {rateClassesShown.map((k) => (
            <span key={k} className="hidden text-xs font-semibold text-ink-muted sm:block">{rateClassLabels[k]} rate class</span>
          ))}
          {categories.map((c) => (
            <div key={c} className="contents">
              <span className="pt-2 text-sm font-semibold">{categoryLabels[c]}</span>
              {rateClassesShown.map((k) => (
                <TextField
                  key={k}
                  label={`${categoryLabels[c]}, ${rateClassLabels[k]}`}
                  className="text-right tabular-nums"
                  inputMode="decimal"
                  placeholder={placeholder}
                  error={errors.rates?.[c]?.[k]?.message}
                  {...form.register(`rates.${c}.${k}`)}
                />
              ))}
            </div>
          ))}
        </div>
      </fieldset>
      <div className="flex justify-end">
        <Button type="submit" data-testid="save-rate-card" busy={create.isPending}>
          Save rate card
        </Button>
      </div>
    </form>
  );
}
