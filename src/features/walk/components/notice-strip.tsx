import { createContext, useContext, useLayoutEffect, useRef, type ReactNode } from "react";

const Folded = createContext(false);

/** Whether a Walk banner is drawn as a chip on the strip's one line (folded) or in full. */
export const useFoldedStrip = () => useContext(Folded);

export type ChipTone = "danger" | "note" | "ok" | "accent";

const TONES: Record<ChipTone, string> = {
  danger: "border-danger bg-danger-soft text-danger",
  note: "border-note bg-note-soft text-note",
  ok: "border-ok bg-ok-soft text-ok",
  accent: "border-accent bg-accent-soft",
};

/**
 * One banner on the folded strip: its words on one line, cut with an ellipsis (the whole text stays for
 * screen readers); a tap on the line shows every banner in full.
 */
export function StripChip({
  tone,
  role,
  children,
  ...data
}: {
  tone: ChipTone;
  role?: "status" | "alert";
  children: ReactNode;
} & Record<`data-${string}`, string | number | undefined>) {
  return (
    <span
      role={role}
      {...data}
      className={`block min-w-[4.5rem] shrink truncate first:max-w-[55%] first:shrink-0 rounded-md border-l-4 px-2 text-sm font-bold leading-[3rem] edge ${TONES[tone]}`}
    >
      {children}
    </span>
  );
}

/**
 * The Walk screen's banners (sync, warnings, the alarm, the still-air advice or pass, notices) folded to
 * one line over the plan, most urgent first; a tap on the line or the button shows them in full, up to
 * 30 % of the screen's height, scrolling beyond it. A phone keeps about half its height for the plan in every
 * state (docs/decisions/0140).
 */
export function NoticeStrip({
  open,
  onOpen,
  children,
}: {
  open: boolean;
  onOpen(open: boolean): void;
  children: ReactNode;
}) {
  // opened, the banners read from the top (the tap that opened them must not leave them scrolled)
  const list = useRef<HTMLDivElement>(null);
  useLayoutEffect(() => {
    if (open && list.current) list.current.scrollTop = 0;
  }, [open]);
  return (
    <div className="flex items-start gap-1" data-testid="notice-strip" data-open={open ? "yes" : "no"}>
      <Folded.Provider value={!open}>
        {open ? (
          <div ref={list} id="walk-notices" className="flex max-h-[30vh] min-w-0 flex-1 flex-col gap-1 overflow-y-auto">
            {children}
          </div>
        ) : (
          // The whole line opens the strip for a gloved thumb (the button beside it is the keyboard's way);
          // a dialog a banner opened is not part of the line.
          <div
            id="walk-notices"
            className="flex min-h-12 min-w-0 flex-1 items-stretch gap-1 overflow-hidden"
            onClick={(e) => {
              if (!(e.target as Element).closest("dialog")) onOpen(true);
            }}
          >
            {children}
          </div>
        )}
      </Folded.Provider>
      <button
        type="button"
        aria-expanded={open}
        aria-controls="walk-notices"
        aria-label={open ? "Fold the notices to one line" : "Show the notices in full"}
        className="flex h-12 w-12 shrink-0 items-center justify-center rounded-md text-lg font-bold edge"
        onClick={() => onOpen(!open)}
      >
        {open ? "▴" : "▾"}
      </button>
    </div>
  );
}
