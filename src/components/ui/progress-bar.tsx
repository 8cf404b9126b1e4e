/** A labelled progress bar (role="progressbar") that states the percentage in text too. */
export function ProgressBar({ label, fraction, detail }: { label: string; fraction: number; detail?: string }) {
  const percent = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-bold">{label}</span>
        <span className="text-ink-soft">
          {percent}%{detail ? ` · ${detail}` : ""}
        </span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={`${percent}%${detail ? `, ${detail}` : ""}`}
        className="h-5 w-full overflow-hidden rounded-full border-2 border-ink/30 bg-white"
      >
        <div className="h-full bg-tide transition-[width] duration-300" style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}
