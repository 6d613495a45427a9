import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { DropZone } from '../../../components/ui/drop-zone';
import { TextField } from '../../../components/ui/field';
import { isApiError } from '../../../lib/api-client';
import { applyApiFieldErrors } from '../../../lib/form-errors';
import { useCreateAccount } from '../api/create-account';
import { type AccountFormValues, type AccountKind, accountFormDefaults, accountFormSchema } from '../lib/account-form-values';

const fields = ['name', 'costCentreCode', 'billingContactEmail', 'taxId', 'poNumber', 'poExpiresOn'] as const;
const maxPoBytes = 10 * 1024 * 1024;

/**
 * A new account for the signed-in person's organisation: a cost centre for an internal group, or an external
 * account (billing contact, tax id, PO) for anyone else; the API refuses the other kind. A PI approves it.
 */
export function AccountForm({ kind }: { kind: AccountKind }) {
  const create = useCreateAccount();
  const [poFile, setPoFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const form = useForm<AccountFormValues, unknown, z.output<typeof accountFormSchema>>({
    resolver: zodResolver(accountFormSchema),
    defaultValues: accountFormDefaults(kind),
  });
  const { errors } = form.formState;

  const pickFile = (file: File | undefined) => {
    if (!file) return;
    if (file.size > maxPoBytes) return setFileError('The PO file is larger than 10 MB');
    if (!/\.pdf$/i.test(file.name) && file.type !== 'application/pdf') return setFileError('The PO file must be a PDF');
    setFileError(null);
    setPoFile(file);
  };

  const onSubmit = form.handleSubmit((input) =>
    create.mutate(
      { input, poFile: kind === 'external' ? poFile : null },
      {
        onSuccess: (account) => {
          toast.success(`${account.name} requested; a PI of your group approves it`);
          form.reset(accountFormDefaults(kind));
          setPoFile(null);
        },
        onError: (error) => {
          if (applyApiFieldErrors(error, form.setError, fields)) return;
          if (isApiError(error) && (error.status === 415 || error.status === 413)) setFileError(error.message);
          else toast.error(error.message);
        },
      },
    ),
  );

  return (
    <form data-testid="account-form" data-kind={kind} onSubmit={onSubmit} noValidate className="space-y-4 rounded-xl border border-line bg-panel p-4">
      <div>
        <h3 className="font-semibold">{kind === 'cost_centre' ? 'Add a cost-centre account' : 'Add an external account'}</h3>
        <p className="text-sm text-ink-muted">
          {kind === 'cost_centre'
            ? 'Beam time charged to it is billed by a journal to the cost centre.'
            : 'Beam time charged to it is invoiced to the billing contact, quoting the PO.'}
        </p>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Account name" error={errors.name?.message} {...form.register('name')} />
        {kind === 'cost_centre' ? (
          <TextField label="Cost centre" placeholder="CC-1234-567" hint="CC-, four digits, -, three digits" autoComplete="off" error={errors.costCentreCode?.message} {...form.register('costCentreCode')} />
        ) : (
          <>
            <TextField label="Billing contact e-mail" type="email" autoComplete="off" error={errors.billingContactEmail?.message} {...form.register('billingContactEmail')} />
            <TextField label="Tax id" hint="Optional (VAT or EIN)" autoComplete="off" error={errors.taxId?.message} {...form.register('taxId')} />
            <TextField label="PO number" autoComplete="off" error={errors.poNumber?.message} {...form.register('poNumber')} />
            <TextField label="PO expires on" type="date" hint="Optional; after it the account cannot take bookings." error={errors.poExpiresOn?.message} {...form.register('poExpiresOn')} />
          </>
        )}
      </div>
      {kind === 'external' && (
        <div className="space-y-1.5">
          <DropZone
            label={poFile ? `PO file: ${poFile.name}` : 'Attach the PO (PDF, optional)'}
            hint="Up to 10 MB. Drop it here or click to choose."
            accept=".pdf,application/pdf"
            name="poFile"
            testId="po-file"
            onFiles={(files) => pickFile(files[0])}
          />
          {poFile && (
            <button type="button" className="text-xs font-semibold text-ink-muted underline" onClick={() => setPoFile(null)}>
              Remove the PO file
            </button>
          )}
          {fileError && <p className="text-xs font-semibold text-danger" data-testid="field-error">{fileError}</p>}
        </div>
      )}
      <div className="flex justify-end">
        <Button type="submit" data-testid="save-account" busy={create.isPending}>
          Request the account
        </Button>
      </div>
    </form>
  );
}
