/** A small line of a fixture's peak ppm across sweeps; gaps where a sweep did not sample it. */
export function TrendSparkline({
  values,
  highlight,
  label,
}: {
  values: (number | null)[];
  highlight: number[];
  label: string;
}) {
  const w = 120;
  const h = 28;
  const max = Math.max(1, ...values.map((v) => v ?? 0));
  const x = (i: number) => (values.length <= 1 ? w / 2 : 4 + (i * (w - 8)) / (values.length - 1));
  const y = (v: number) => h - 3 - (v / max) * (h - 6);
  const segments: string[] = [];
  let current: string[] = [];
  values.forEach((v, i) => {
    if (v === null) {
      if (current.length) segments.push(current.join(" "));
      current = [];
    } else current.push(`${x(i).toFixed(1)},${y(v).toFixed(1)}`);
  });
  if (current.length) segments.push(current.join(" "));
  return (
    <svg width={w} height={h} role="img" aria-label={label} className="overflow-visible">
      {segments.map((pts, i) => (
        <polyline key={i} points={pts} fill="none" stroke="#1f4e5f" strokeWidth={1.5} />
      ))}
      {values.map((v, i) =>
        v === null ? null : (
          <circle
            key={i}
            cx={x(i)}
            cy={y(v)}
            r={highlight.includes(i) ? 3.2 : 1.8}
            fill={highlight.includes(i) ? "#9b2c2c" : "#1f4e5f"}
          />
        ),
      )}
    </svg>
  );
}
