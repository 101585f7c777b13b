import type { ReactNode } from "react";

type Tone = "info" | "error" | "success" | "note";

const TONES: Record<Tone, string> = {
  info: "bg-accent-soft border-accent",
  error: "bg-danger-soft border-danger text-danger",
  success: "bg-ok-soft border-ok text-ok",
  note: "bg-note-soft border-note text-note",
};

/** Errors interrupt (role=alert); everything else is announced politely (role=status). */
export function Alert({ tone = "info", title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-md edge border-l-4 px-4 py-3 ${TONES[tone]}`}>
      {title ? <p className="font-bold">{title}</p> : null}
      {children ? <div className="text-ink">{children}</div> : null}
    </div>
  );
}
