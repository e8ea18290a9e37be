// A horizontal bar for a fraction in [0, 1], with the percentage for screen readers and an optional caption.
export function ProgressBar({
  fraction,
  label,
  tone = "brand",
}: {
  fraction: number;
  label: string;
  tone?: "brand" | "muted" | "danger";
}) {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(fraction) ? fraction : 0));
  const percent = Math.round(clamped * 1000) / 10;
  const fill = tone === "danger" ? "bg-red-600" : tone === "muted" ? "bg-slate-400" : "bg-brand-600";
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={percent}
      className="h-3 w-full overflow-hidden rounded-full bg-slate-200"
    >
      <div className={`h-full ${fill} transition-[width] duration-500 ease-out`} style={{ width: `${percent}%` }} />
    </div>
  );
}
