import type { ChangeoverModel } from './changeover-model';

/**
 * Demo defaults, invented for the seed and marked as such: the figures follow common practice
 * (re-peaking within one output takes minutes, swapping to the DFG crystal most of an hour),
 * not any measured source. Staff edit the real model per facility.
 */
export const defaultChangeoverModel: ChangeoverModel = {
  pairs: [
    { from: 'fundamental', to: 'shg', baseMinutes: 15 },
    { from: 'fundamental', to: 'opa_signal', baseMinutes: 20 },
    { from: 'fundamental', to: 'opa_idler', baseMinutes: 20 },
    { from: 'shg', to: 'opa_signal', baseMinutes: 25 },
    { from: 'shg', to: 'opa_idler', baseMinutes: 25 },
    { from: 'opa_signal', to: 'opa_idler', baseMinutes: 10 },
    { from: 'opa_signal', to: 'dfg', baseMinutes: 45 },
    { from: 'opa_idler', to: 'dfg', baseMinutes: 45 },
    { from: 'fundamental', to: 'dfg', baseMinutes: 50 },
    { from: 'shg', to: 'dfg', baseMinutes: 55 },
  ],
  retuneMinutesPerNm: 0.05,
  retuneMinutesPerNmByConfiguration: { fundamental: 0.2, shg: 0.3, dfg: 0.005 },
  warmupAfterMaintenanceMinutes: 30,
  pulseCheckMinutes: 5,
  defaultBaseMinutes: 30,
};
