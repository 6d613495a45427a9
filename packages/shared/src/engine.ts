// The pure engine: units, optics, changeover, timeline, planner, metrology. No I/O.
export * from './units/engine-error';
export * from './units/spectral-units';
export * from './optics/mixing';
export * from './optics/table-wavelengths';
export * from './optics/eyewear';
export * from './optics/feasibility';
export * from './optics/demo-configurations';
export * from './changeover/changeover-model';
export * from './changeover/default-changeover-model';
export * from './timeline/timeline-schemas';
export {
  checkTimeline,
  findAlternativeSlots,
  minutesNeededAfterBlock,
  type NeighbourCheck,
  type TimelineCheck,
  type TimeSlot,
} from './timeline/timeline-check';
export * from './planner/plan-schemas';
export { planDay } from './planner/plan-day';
export { seededRandom } from './planner/seeded-random';
export * from './metrology/autocorrelation';
export * from './metrology/time-bandwidth';
export * from './metrology/autocorrelation-csv';
export * from './metrology/pulse-limits';
export * from './timeline/offer-slots';
