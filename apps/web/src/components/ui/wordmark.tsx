import { cx } from '../../lib/cx';

// A few cycles of carrier under a Gaussian envelope: the short pulse the facility sells time on.
const pulsePath = (() => {
  const steps = 96;
  const points: string[] = [];
  for (let i = 0; i <= steps; i += 1) {
    const t = (i / steps) * 2 - 1;
    const envelope = Math.exp(-((t / 0.38) ** 2));
    const y = 12 - 8.5 * envelope * Math.cos(t * 7 * Math.PI);
    points.push(`${(2 + i * (28 / steps)).toFixed(2)},${y.toFixed(2)}`);
  }
  return `M${points.join(' L')}`;
})();

export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={cx('inline-flex items-center gap-2', className)}>
      <svg viewBox="0 0 32 24" aria-hidden="true" className="h-6 w-8">
        <rect x="0.75" y="0.75" width="30.5" height="22.5" rx="6" className="fill-accent-soft stroke-accent/40" strokeWidth="1" />
        <path d={pulsePath} fill="none" className="stroke-accent" strokeWidth="1.6" strokeLinejoin="round" strokeLinecap="round" />
      </svg>
      <span className="text-lg leading-none font-extrabold tracking-tight">
        femto<span className="text-accent">slot</span>
      </span>
    </span>
  );
}
