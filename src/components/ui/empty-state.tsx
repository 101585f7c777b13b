import type { ReactNode } from "react";

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-md edge border-dashed bg-surface px-4 py-8 text-center">
      <p className="text-lg font-bold">{title}</p>
      {children ? <div className="mx-auto mt-2 max-w-prose text-muted">{children}</div> : null}
    </div>
  );
}
