import { describe, expect, test } from 'vitest';
import { accountFormDefaults, accountFormSchema } from './account-form-values';

describe('account form values', () => {
  test('when a cost centre is typed in lower case, then it is sent upper case and only its own fields go out', () => {
    const result = accountFormSchema.safeParse({ ...accountFormDefaults('cost_centre'), name: 'Kestrel group', costCentreCode: ' cc-1234-567 ', poNumber: 'ignored' });
    expect(result.data).toEqual({ kind: 'cost_centre', name: 'Kestrel group', costCentreCode: 'CC-1234-567' });
  });

  test('when a cost centre code is not in the CC-0000-000 format, then the error sits on that field', () => {
    const result = accountFormSchema.safeParse({ ...accountFormDefaults('cost_centre'), name: 'Kestrel group', costCentreCode: 'CC-12-3' });
    expect(result.error?.issues.map((i) => i.path.join('.'))).toEqual(['costCentreCode']);
  });

  test('when an external account leaves tax id and PO expiry empty, then they are left out instead of failing', () => {
    const result = accountFormSchema.safeParse({ ...accountFormDefaults('external'), name: 'Sensor Co', billingContactEmail: 'AP@Sensor.test', poNumber: 'PO-7781' });
    expect(result.data).toEqual({ kind: 'external', name: 'Sensor Co', billingContactEmail: 'ap@sensor.test', poNumber: 'PO-7781' });
  });

  test('when an external account has no PO number or a bad e-mail, then each field gets its message', () => {
    const result = accountFormSchema.safeParse({ ...accountFormDefaults('external'), name: 'Sensor Co', billingContactEmail: 'nope' });
    expect(result.error?.issues.map((i) => i.path.join('.')).sort()).toEqual(['billingContactEmail', 'poNumber']);
  });
});
