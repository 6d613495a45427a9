import { checkTargetFeasibility, eyewearCoverage, opaRangesOf, type BookingTarget } from '@femtoslot/shared';
import type { Configuration } from '../instruments/configuration.entity';
import type { EyewearItem } from '../safety/eyewear-item.entity';

/**
 * The optics rules of one booking: the target against the configuration's tuning range (and, for DFG, the
 * instrument's OPA ranges), then the eyewear against the required OD at every wavelength on the table. The booking
 * check and the administration preview both ask here.
 */
export function checkOptics(
  configuration: Configuration,
  instrument: { pumpNm: number | null },
  configurations: Iterable<Configuration>,
  target: BookingTarget,
  eyewear: EyewearItem[],
) {
  const feasibility = checkTargetFeasibility(target, {
    outputKind: configuration.outputKind, minNm: configuration.minNm, maxNm: configuration.maxNm, pumpNm: instrument.pumpNm ?? undefined,
    name: configuration.name, opa: opaRangesOf(configurations),
  });
  const coverage = feasibility.feasible ? eyewearCoverage(feasibility.onTable, configuration.requiredOdBands, eyewear) : null;
  return { feasibility, coverage };
}
