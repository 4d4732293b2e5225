/** Largest band shift |ΔE| along the path against the base release: how much the physics moved, at a glance. */
export function ShiftSparkline({ profile, max }: { profile: number[] | null; max: number | null }) {
  if (!profile || profile.length < 2 || max === null) {
    return <span className="text-xs text-ink-soft">no base to compare</span>;
  }
  const w = 96;
  const h = 22;
  const top = Math.max(max, 1e-6);
  const points = profile.map((v, i) => `${((i / (profile.length - 1)) * w).toFixed(1)},${(h - (v / top) * (h - 2) - 1).toFixed(1)}`).join(" ");
  return (
    <span className="flex items-center gap-1.5" title="largest |ΔE| along the default path against the base release">
      <svg width={w} height={h} aria-hidden className="shrink-0">
        <polyline points={`0,${h} ${points} ${w},${h}`} fill="var(--color-copper-pale)" stroke="none" />
        <polyline points={points} fill="none" stroke="var(--color-copper-deep)" strokeWidth={1.2} />
      </svg>
      <span className="num text-xs">
        <span className="sr-only">largest band shift </span>|ΔE| ≤ {max < 0.001 ? max.toExponential(1) : max.toFixed(3)} eV
      </span>
    </span>
  );
}
