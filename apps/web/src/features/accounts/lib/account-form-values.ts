import { type CreateAccountInput, createAccountInputSchema } from '@femtoslot/shared';
import { z } from 'zod';

export type AccountKind = CreateAccountInput['kind'];

export interface AccountFormValues {
  kind: AccountKind;
  name: string;
  costCentreCode: string;
  billingContactEmail: string;
  taxId: string;
  poNumber: string;
  poExpiresOn: string;
}

export const accountFormDefaults = (kind: AccountKind): AccountFormValues => ({
  kind, name: '', costCentreCode: '', billingContactEmail: '', taxId: '', poNumber: '', poExpiresOn: '',
});

/** Only the fields of the chosen kind, with empty optional text left out (the shared schema is strict). */
export function toCreateAccountInput(values: AccountFormValues): Record<string, string> {
  const optional = (text: string) => (text.trim() ? text.trim() : undefined);
  const picked = values.kind === 'cost_centre'
    ? { kind: values.kind, name: values.name, costCentreCode: values.costCentreCode.trim().toUpperCase() }
    : {
        kind: values.kind, name: values.name, billingContactEmail: values.billingContactEmail, taxId: optional(values.taxId),
        poNumber: values.poNumber, poExpiresOn: optional(values.poExpiresOn),
      };
  return Object.fromEntries(Object.entries(picked).filter(([, v]) => v !== undefined)) as Record<string, string>;
}

/** The form's text through createAccountInputSchema; its issue paths are the form's field names. */
export const accountFormSchema = z
  .object({
    kind: z.enum(['cost_centre', 'external']),
    name: z.string(),
    costCentreCode: z.string(),
    billingContactEmail: z.string(),
    taxId: z.string(),
    poNumber: z.string(),
    poExpiresOn: z.string(),
  })
  .transform(toCreateAccountInput)
  .pipe(createAccountInputSchema);
