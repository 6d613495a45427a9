import type { OrganisationKind, Role } from '@femtoslot/shared';

/**
 * The invented demo scenario. Every name here is made up; none is a real facility or person.
 * Demo data only: never used as truth in a test.
 */
export const demoFacility = {
  name: 'Harrow Point University — Ultrafast Spectroscopy Core',
  timeZone: 'America/New_York',
  currency: 'USD',
  policies: {
    minBookingHours: 1,
    maxBookingHours: 12,
    horizonDays: 60,
    externalLeadHours: 12,
    cancellationFreeHours: 72,
    cancellationHalfFeeHours: 24,
    usageGraceMinutes: 30,
    // Invented demo specification of the amplifier's pulse duration.
    pumpPulseSpecFs: 45,
    workingHours: { start: '08:00', end: '18:00', weekdays: [1, 2, 3, 4, 5] },
  },
};

export const demoPassword = 'femtoslot-demo';

export const demoOrganisations: { key: string; name: string; kind: OrganisationKind }[] = [
  { key: 'core', name: 'Ultrafast Spectroscopy Core (facility)', kind: 'internal' },
  { key: 'kestrel', name: 'Kestrel Lab — Carrier Dynamics', kind: 'internal' },
  { key: 'wrenfield', name: 'Wrenfield Group — Quantum Materials', kind: 'internal' },
  { key: 'callow', name: 'Callow Bay College — Molecular Spectroscopy', kind: 'external_academic' },
  { key: 'sedgeline', name: 'Sedgeline Sensors Inc.', kind: 'industry' },
];

export const demoUsers: { email: string; name: string; role: Role; org: string; trainingValid: boolean }[] = [
  { email: 'admin@harrowpoint.test', name: 'Tamsin Oduya', role: 'admin', org: 'core', trainingValid: true },
  { email: 'staff@harrowpoint.test', name: 'Ilse Marchetti', role: 'staff', org: 'core', trainingValid: true },
  { email: 'finance@harrowpoint.test', name: 'Royce Adeyemi-Lund', role: 'finance', org: 'core', trainingValid: false },
  { email: 'pi@harrowpoint.test', name: 'Prof. Hollis Varga', role: 'pi', org: 'kestrel', trainingValid: true },
  { email: 'member@harrowpoint.test', name: 'Nadia Quenneville', role: 'member', org: 'kestrel', trainingValid: true },
  { email: 'collaborator@harrowpoint.test', name: 'Dr. Emeka Strand', role: 'collaborator', org: 'callow', trainingValid: true },
  { email: 'wren.member@harrowpoint.test', name: 'Jonah Petrakis', role: 'member', org: 'wrenfield', trainingValid: true },
  { email: 'wren.pi@harrowpoint.test', name: 'Dr. Aurelie Banerjee', role: 'pi', org: 'wrenfield', trainingValid: true },
  { email: 'sensors@sedgeline.test', name: 'Marisol Kettering', role: 'collaborator', org: 'sedgeline', trainingValid: true },
  { email: 'lapsed@sedgeline.test', name: 'Bram Okonkwo', role: 'collaborator', org: 'sedgeline', trainingValid: false },
];

export const demoAccounts = [
  { org: 'kestrel', kind: 'cost_centre' as const, name: 'Kestrel Lab operating', costCentreCode: 'CC-4410-217', billingContactEmail: null, poNumber: null },
  { org: 'wrenfield', kind: 'cost_centre' as const, name: 'Wrenfield Group grant QM-9', costCentreCode: 'CC-5120-033', billingContactEmail: null, poNumber: null },
  { org: 'core', kind: 'cost_centre' as const, name: 'Core facility internal', costCentreCode: 'CC-1000-001', billingContactEmail: null, poNumber: null },
  { org: 'callow', kind: 'external' as const, name: 'Callow Bay College — Spectroscopy', costCentreCode: null, billingContactEmail: 'ap@callowbay.test', poNumber: 'CBC-PO-77120' },
  { org: 'sedgeline', kind: 'external' as const, name: 'Sedgeline Sensors — R&D', costCentreCode: null, billingContactEmail: 'payables@sedgeline.test', poNumber: 'SS-2026-0419' },
];

export const demoInstruments = [
  { key: 'aurora', name: 'Aurora line', kind: 'source' as const, description: 'Ti:sapphire oscillator and regenerative amplifier at 800 nm pumping an OPA with signal, idler and DFG mid-IR stages', pumpNm: 800 },
  { key: 'pump-probe', name: 'Pump-probe station', kind: 'bench' as const, description: 'Pump-probe bench for carrier and gain dynamics', pumpNm: null },
  { key: 'autocorrelator', name: 'Autocorrelator bench', kind: 'bench' as const, description: 'Intensity autocorrelator for pulse-duration checks', pumpNm: null },
];

/** Eyewear bands and ODs are invented demo values: real ones come from the manufacturer and the laser-safety officer. */
export const demoEyewear = [
  { label: 'Goggle A — Ti:sapphire + SHG', description: 'Demo item: visible-to-near-IR absorber', bands: [{ minNm: 380, maxNm: 420, od: 6 }, { minNm: 740, maxNm: 1100, od: 7 }] },
  { label: 'Goggle B — OPA near-IR', description: 'Demo item: broadband near-IR', bands: [{ minNm: 740, maxNm: 1100, od: 7 }, { minNm: 1100, maxNm: 2700, od: 6 }] },
  { label: 'Goggle C — mid-IR wide', description: 'Demo item: near- and mid-IR', bands: [{ minNm: 750, maxNm: 2700, od: 7 }, { minNm: 2600, maxNm: 11500, od: 6 }] },
];

/** Invented demo rate card: internal 60, external academic 110, industry 260 USD/h; DFG class +25 %. */
export const demoRateCard = {
  name: 'Demo rate card',
  billingIncrementMinutes: 15,
  changeoverSharePercent: 0,
  minimumChargeMinutes: 60,
  rates: {
    internal: { standard: 6_000, dfg: 7_500 },
    external_academic: { standard: 11_000, dfg: 13_750 },
    industry: { standard: 26_000, dfg: 32_500 },
  },
};
