import type { ConfigurationDto } from '../facility/facility.schemas';

/** A configuration before it is stored: no ids yet; the demo's required ODs are invented (the laser-safety officer sets them). */
export type DemoConfiguration = Omit<ConfigurationDto, 'id' | 'instrumentId' | 'retuneMinutesPerNm' | 'active'>;

/**
 * Demo configurations of the invented "Aurora line" source (invented demo ranges).
 * Default wavelengths and OD values are invented for the demo.
 */
const pumpNearIr = { minNm: 740, maxNm: 1100, od: 7 };
export const demoConfigurations: readonly DemoConfiguration[] = [
  { key: 'fundamental', name: 'Fundamental 800 nm', outputKind: 'fundamental', minNm: 780, maxNm: 820, defaultNm: 800, rateClass: 'standard', requiredOdBands: [pumpNearIr] },
  { key: 'shg', name: 'SHG', outputKind: 'shg', minNm: 390, maxNm: 410, defaultNm: 400, rateClass: 'standard', requiredOdBands: [{ minNm: 380, maxNm: 420, od: 6 }, pumpNearIr] },
  { key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [pumpNearIr, { minNm: 1100, maxNm: 2700, od: 6 }] },
  { key: 'opa_idler', name: 'OPA idler', outputKind: 'opa_idler', minNm: 1600, maxNm: 2600, defaultNm: 2080, rateClass: 'standard', requiredOdBands: [pumpNearIr, { minNm: 1100, maxNm: 2700, od: 6 }] },
  { key: 'dfg', name: 'DFG mid-IR', outputKind: 'dfg', minNm: 2600, maxNm: 11000, defaultNm: 4000, rateClass: 'dfg', requiredOdBands: [pumpNearIr, { minNm: 1100, maxNm: 2600, od: 6 }, { minNm: 2600, maxNm: 11000, od: 5 }] },
];
