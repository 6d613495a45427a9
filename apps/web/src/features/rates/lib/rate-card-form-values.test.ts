import { describe, expect, test } from 'vitest';
import { type RateCardFormValues, rateCardFormDefaults, rateCardFormSchema } from './rate-card-form-values';

const values = (over: Partial<RateCardFormValues> = {}): RateCardFormValues => ({
  name: 'Rates from October',
  effectiveFrom: '2026-10-01',
  effectiveTo: '',
  billingIncrementMinutes: '15',
  changeoverSharePercent: '0',
  minimumChargeMinutes: '60',
  rates: {
    internal: { standard: '60', dfg: '75.00' },
    external_academic: { standard: '137.50', dfg: '171.88' },
    industry: { standard: '260', dfg: '325' },
  },
  ...over,
});

describe('rate card form values', () => {
  test('when amounts are typed in dollars, then the input carries exact cents per hour', () => {
    const result = rateCardFormSchema('USD').safeParse(values());
    expect(result.success).toBe(true);
    expect(result.data).toMatchObject({
      currency: 'USD',
      effectiveTo: null,
      minimumChargeMinutes: 60,
      rates: { internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 13750, dfg: 17188 }, industry: { standard: 26000, dfg: 32500 } },
    });
  });

  test('when the currency is JPY (ISO 4217 exponent 0), then "5000" is 5000 and "5000.5" is refused at that rate', () => {
    const ok = rateCardFormSchema('JPY').safeParse(values({ rates: { ...values().rates, internal: { standard: '5000', dfg: '6250' }, external_academic: { standard: '9000', dfg: '11250' }, industry: { standard: '20000', dfg: '25000' } } }));
    expect(ok.data?.rates.internal.standard).toBe(5000);
    const bad = rateCardFormSchema('JPY').safeParse(values({ rates: { ...values().rates, internal: { standard: '5000.5', dfg: '6250' } } }));
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join('.'))).toContain('rates.internal.standard');
  });

  test('when the end date is not after the start, then the shared schema refuses it on effectiveTo', () => {
    const result = rateCardFormSchema('USD').safeParse(values({ effectiveTo: '2026-09-30' }));
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['effectiveTo']);
  });

  test('when a card exists, then the defaults copy its rates back as exact decimal text', () => {
    const latest = { id: 'c', name: 'Old', effectiveFrom: '2026-01-01', effectiveTo: null, currency: 'USD', billingIncrementMinutes: 30, changeoverSharePercent: 50, minimumChargeMinutes: 0,
      rates: { internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 11000, dfg: 13750 }, industry: { standard: 26001, dfg: 32500 } } };
    const defaults = rateCardFormDefaults(latest, 'USD', '2026-11-01');
    expect(defaults.rates.industry.standard).toBe('260.01');
    expect(defaults.billingIncrementMinutes).toBe('30');
    expect(rateCardFormSchema('USD').safeParse({ ...defaults, name: 'New' }).data?.rates).toEqual(latest.rates);
  });
});
