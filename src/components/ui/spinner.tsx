/** A quiet progress mark with a spoken label; motion stops for users who ask for less. */
export function Spinner({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-4 text-muted">
      <span
        aria-hidden="true"
        className="size-5 animate-spin rounded-full border-4 border-line border-t-accent motion-reduce:animate-none"
      />
      <span>{label}</span>
    </div>
  );
}
