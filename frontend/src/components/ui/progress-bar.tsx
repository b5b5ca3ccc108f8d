/**
 * A determinate progress bar. The visible text and aria-valuetext say the same thing so a
 * screen reader hears "1 234 of 2 000 files", not a bare percentage.
 */
export function ProgressBar({
  label,
  value,
  max,
  valueText,
  tone = 'ember',
}: {
  label: string;
  value: number;
  max: number;
  valueText: string;
  tone?: 'ember' | 'blue' | 'danger';
}) {
  const pct = max > 0 ? Math.min(100, Math.max(0, (value / max) * 100)) : 0;
  const fill = tone === 'blue' ? 'bg-blueend-500' : tone === 'danger' ? 'bg-danger-600' : 'bg-ember-500';
  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span className="font-medium text-ink-800">{label}</span>
        <span className="num text-ink-600">{valueText}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={max}
        aria-valuenow={value}
        aria-valuetext={valueText}
        className="h-2.5 overflow-hidden rounded-full border border-paper-300 bg-paper-200"
      >
        <div className={`h-full ${fill} transition-[width] duration-200`} style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
