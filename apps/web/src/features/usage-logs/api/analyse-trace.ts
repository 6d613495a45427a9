import type { PulseShape } from '@femtoslot/shared';
import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface TraceAnalysis {
  acFwhmFs: number;
  pulseFwhmFs: number;
  shape: PulseShape;
  baseline: number;
  peakDelayFs: number;
}

export interface AnalyseTraceVariables {
  file: File;
  shape: PulseShape;
}

/** The server's reading of an autocorrelation trace; it is the value the log keeps. */
export const analyseTrace = ({ file, shape }: AnalyseTraceVariables) => {
  const form = new FormData();
  form.append('trace', file, file.name);
  form.append('shape', shape);
  return apiClient.postForm<TraceAnalysis>('/api/optics/autocorrelation', form);
};

export function useAnalyseTrace() {
  return useMutation({ mutationFn: analyseTrace });
}
