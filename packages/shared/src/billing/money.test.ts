import { describe, expect, it } from 'vitest';
import { divideHalfUp, formatMoney, lineAmountMinor, minorToDecimalString, minorUnitExponent, sumMinor, withSurcharge } from './money';

describe('money in minor units', () => {
  it('when a line lands on half a cent, then it rounds half-up (3 h 15 min × $137.50/h = $446.875 → $446.88, by hand)', () => {
    // 195 min × 13 750 ¢/h = 2 681 250; ÷ 60 = 44 687.5 → 44 688 ¢
    expect(lineAmountMinor(195, 13_750)).toBe(44_688);
  });

  it('when a line is just below half a cent, then it rounds down (7 min × $137.50/h = $16.0416… → $16.04, by hand)', () => {
    expect(lineAmountMinor(7, 13_750)).toBe(1_604);
  });

  it('when dividing negatives, then half rounds away from zero, like its positive twin', () => {
    expect(divideHalfUp(-3, 2)).toBe(-2);
    expect(divideHalfUp(3, 2)).toBe(2);
  });

  it('when the DFG class adds 25 %, then $60/$110/$260 become $75/$137.50/$325 (demo rates × 1.25, by hand)', () => {
    expect([withSurcharge(6_000, 25), withSurcharge(11_000, 25), withSurcharge(26_000, 25)]).toEqual([7_500, 13_750, 32_500]);
  });

  it('when the currency is JPY, then it has no minor digits (ISO 4217 minor unit 0) and lines round to whole yen', () => {
    expect(minorUnitExponent('JPY')).toBe(0);
    // 45 min × ¥9 002/h = 405 090; ÷ 60 = 6 751.5 → ¥6 752 (by hand)
    expect(lineAmountMinor(45, 9_002)).toBe(6_752);
    expect(minorToDecimalString(6_752, 'JPY')).toBe('6752');
    expect(formatMoney(6_752, 'JPY')).toBe('¥6,752');
  });

  it('when the currency is USD or KWD, then the exponents are 2 and 3 (ISO 4217) and display follows them', () => {
    expect(minorUnitExponent('USD')).toBe(2);
    expect(minorUnitExponent('KWD')).toBe(3);
    expect(minorToDecimalString(5, 'USD')).toBe('0.05');
    expect(formatMoney(44_688, 'USD')).toBe('$446.88');
  });

  it('when a currency is not in the table, then it is refused rather than guessed', () => {
    expect(() => minorUnitExponent('XYZ')).toThrow(/ISO 4217/);
  });

  it('when totals are summed, then only integers are accepted', () => {
    expect(sumMinor([44_688, 16_500, 0])).toBe(61_188);
    expect(() => sumMinor([0.5])).toThrow();
  });
});
