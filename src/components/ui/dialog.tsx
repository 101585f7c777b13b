import { useEffect, useId, useRef, type ReactNode } from "react";

/** A modal dialog on the native <dialog> element (focus trap and Escape come with it). */
export function Dialog({
  title,
  open,
  onClose,
  children,
  wide = false,
}: {
  title: string;
  open: boolean;
  onClose(): void;
  children: ReactNode;
  wide?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const id = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={id}
      onClose={onClose}
      className={`m-auto max-h-[90dvh] ${wide ? "w-[min(96vw,48rem)]" : "w-[min(96vw,32rem)]"} overflow-auto rounded-lg bg-surface p-0 text-ink edge backdrop:bg-black/50`}
    >
      {open ? (
        <div className="flex flex-col gap-3 p-4">
          <h2 id={id} className="text-xl font-bold">
            {title}
          </h2>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
