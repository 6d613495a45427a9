import type { AutocorrelationResult } from '@femtoslot/shared';
import { useMemo } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { halfMaximumMarks, traceChartPoints } from '../lib/trace-marks';

const fs = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });
const signalFormat = new Intl.NumberFormat('en', { maximumSignificantDigits: 4 });

export interface TracePlotProps {
  points: Array<[number, number]>;
  analysis: AutocorrelationResult;
  /** colour of the configuration the segment used */
  colour: string;
}

/** The uploaded autocorrelation with its half-maximum level and the two crossings that set the FWHM. */
export function TracePlot({ points, analysis, colour }: TracePlotProps) {
  const data = useMemo(() => traceChartPoints(points), [points]);
  const marks = useMemo(() => halfMaximumMarks(points, analysis), [points, analysis]);
  const caption =
    `Autocorrelation FWHM ${fs.format(analysis.autocorrelationFwhmFs)} fs → pulse FWHM ${fs.format(analysis.pulseFwhmFs)} fs ` +
    `(${analysis.shape === 'sech2' ? 'sech²' : 'Gaussian'}, ÷ ${analysis.deconvolutionFactor.toFixed(4)})`;
  return (
    <figure data-testid="trace-plot" className="rounded-lg border border-line bg-panel p-3" data-ac-fwhm-fs={analysis.autocorrelationFwhmFs}>
      <LineChart responsive data={data} margin={{ top: 16, right: 20, bottom: 22, left: 8 }} style={{ width: '100%', height: 240 }}>
        <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" />
        <XAxis
          dataKey="delayFs"
          type="number"
          domain={['dataMin', 'dataMax']}
          tickFormatter={(v: number) => fs.format(v)}
          label={{ value: 'Delay (fs)', position: 'insideBottom', offset: -12, fill: 'var(--color-ink-muted)', fontSize: 12 }}
          tick={{ fill: 'var(--color-ink-muted)', fontSize: 11 }}
        />
        <YAxis
          dataKey="signal"
          type="number"
          width={56}
          tickFormatter={(v: number) => signalFormat.format(v)}
          label={{ value: 'Signal', angle: -90, position: 'insideLeft', fill: 'var(--color-ink-muted)', fontSize: 12 }}
          tick={{ fill: 'var(--color-ink-muted)', fontSize: 11 }}
        />
        <Tooltip
          formatter={(value) => [signalFormat.format(Number(value)), 'Signal']}
          labelFormatter={(label) => `Delay ${fs.format(Number(label))} fs`}
          contentStyle={{ background: 'var(--color-panel)', borderColor: 'var(--color-line)', fontSize: 12 }}
        />
        <ReferenceLine y={analysis.baseline} stroke="var(--color-ink-muted)" strokeDasharray="1 3" />
        {marks && (
          <>
            <ReferenceLine
              y={marks.level}
              stroke="var(--color-caution-line)"
              strokeDasharray="5 4"
              label={{ value: `half maximum · AC FWHM ${fs.format(analysis.autocorrelationFwhmFs)} fs`, position: 'insideTopRight', fill: 'var(--color-ink)', fontSize: 11 }}
            />
            <ReferenceLine
              segment={[{ x: marks.leftDelayFs, y: marks.level }, { x: marks.rightDelayFs, y: marks.level }]}
              stroke="var(--color-caution-line)"
              strokeWidth={2.5}
            />
            <ReferenceDot x={marks.leftDelayFs} y={marks.level} r={5} fill="var(--color-panel)" stroke="var(--color-caution-line)" strokeWidth={2} />
            <ReferenceDot x={marks.rightDelayFs} y={marks.level} r={5} fill="var(--color-panel)" stroke="var(--color-caution-line)" strokeWidth={2} />
          </>
        )}
        <Line type="linear" dataKey="signal" stroke={colour} strokeWidth={1.8} dot={false} isAnimationActive={false} />
      </LineChart>
      <figcaption className="mt-1 text-xs text-ink-muted">
        {caption}.
        {marks && ` Half maximum crossed at ${fs.format(marks.leftDelayFs)} fs and ${fs.format(marks.rightDelayFs)} fs.`}
      </figcaption>
    </figure>
  );
}
