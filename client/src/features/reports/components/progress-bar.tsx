/** A labelled progress bar (role progressbar, value in percent); indeterminate when `fraction` is null. */
export function ProgressBar({ label, fraction, detail, tone = 'reference', testId }: { label: string; fraction: number | null; detail?: string; tone?: 'reference' | 'bonding' | 'antibonding'; testId?: string }) {
  const percent = fraction === null ? null : Math.max(0, Math.min(100, Math.round(fraction * 100)));
  const fill = tone === 'bonding' ? 'bg-bonding' : tone === 'antibonding' ? 'bg-antibonding' : 'bg-reference';
  return (
    <div className="flex flex-col gap-1" data-testid={testId}>
      <div className="flex items-baseline justify-between gap-3 text-[0.85rem]">
        <span className="font-semibold text-ink">{label}</span>
        <span className="num text-graphite">{detail ?? (percent === null ? '' : `${percent}%`)}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={detail ?? (percent === null ? 'working' : `${percent}%`)}
        className="h-2 w-full overflow-hidden rounded-[2px] border border-rule bg-wash"
      >
        <div className={`h-full ${fill} ${percent === null ? 'w-1/3 animate-pulse' : ''}`} style={percent === null ? undefined : { width: `${percent}%` }} />
      </div>
    </div>
  );
}
