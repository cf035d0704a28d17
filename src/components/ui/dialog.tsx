import { useEffect, useRef, type ReactNode } from 'react';

/** A modal on the native <dialog>: focus stays inside, Escape closes it. */
export function Dialog({ open, title, onClose, children }: { open: boolean; title: string; onClose(): void; children: ReactNode }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="dialog-title"
      className="m-auto w-full max-w-lg rounded-xl border border-ink/10 bg-paper p-0 text-ink shadow-2xl backdrop:bg-ink/50"
    >
      {open && (
        <div className="p-5">
          <h2 id="dialog-title" className="mb-4 text-lg font-bold">
            {title}
          </h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
