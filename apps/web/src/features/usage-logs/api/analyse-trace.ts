import type { PulseShape } from '@femtoslot/shared';
import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface TraceAnalysis {
  acFwhmFs: number;
  pulseFwhmFs: number;
  shape: PulseShape;
  baseline: number;
  peakDelayFs: number;
  /** the centre wavelength the optical-cycle check used, and that cycle */
  centreNm: number;
  opticalCycleFs: number;
  transformLimitedFs: number | null;
}

export interface AnalyseTraceVariables {
  file: File;
  shape: PulseShape;
  /** the segment's shortest wavelength: the pulse must last at least one optical cycle there */
  centreNm?: number;
  spectralFwhmNm?: number;
}

/** The server's reading of an autocorrelation trace; it is the value the log keeps. */
export const analyseTrace = ({ file, shape, centreNm, spectralFwhmNm }: AnalyseTraceVariables) => {
  const form = new FormData();
  form.append('shape', shape);
  if (centreNm !== undefined) form.append('centreNm', String(centreNm));
  if (spectralFwhmNm !== undefined) form.append('spectralFwhmNm', String(spectralFwhmNm));
  form.append('trace', file, file.name);
  return apiClient.postForm<TraceAnalysis>('/api/optics/autocorrelation', form);
};

export function useAnalyseTrace() {
  return useMutation({ mutationFn: analyseTrace });
}
