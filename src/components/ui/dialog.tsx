import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { useBlocker } from 'react-router-dom';
import { Button } from './button';

/**
 * Navigation state of a dialog that moves on to what it created once its
 * request succeeded: `navigate(url, { state: SENT_FROM_DIALOG })` passes the leave guard.
 */
export const SENT_FROM_DIALOG = { sentFromDialog: true } as const;

/**
 * A modal on the native <dialog>: focus stays inside, Escape closes it. Once
 * something has been typed in it, leaving the page (browser Back, a link)
 * asks first, as the technique editor does.
 */
export function Dialog({ open, title, onClose, children }: { open: boolean; title: string; onClose(): void; children: ReactNode }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const [typed, setTyped] = useState(false);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
    if (!open) setTyped(false);
  }, [open]);
  return (
    <dialog
      ref={ref}
      // React passes a nested dialog's close event up its tree: only this dialog's own closing closes it.
      onClose={(event) => {
        if (event.target === ref.current) onClose();
      }}
      onInput={() => setTyped(true)}
      onKeyDown={(event) => {
        // A modal <dialog> makes the page inert but lets Tab leave for the browser's own controls: keep it going round inside.
        if (event.key !== 'Tab' || event.target === null) return;
        const focusable = [...(ref.current?.querySelectorAll<HTMLElement>('a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])') ?? [])].filter(
          (element) => element.offsetParent !== null && element.closest('dialog') === ref.current,
        );
        if (!focusable.length) return;
        const first = focusable[0];
        const last = focusable[focusable.length - 1];
        if (!event.shiftKey && document.activeElement === last) {
          event.preventDefault();
          first.focus();
        } else if (event.shiftKey && document.activeElement === first) {
          event.preventDefault();
          last.focus();
        }
      }}
      aria-labelledby={titleId}
      className="m-auto w-full max-w-lg rounded-xl border border-ink/10 bg-paper p-0 text-ink shadow-2xl backdrop:bg-ink/50"
    >
      {open && (
        <div className="p-5">
          <h2 id={titleId} className="mb-4 text-lg font-bold">
            {title}
          </h2>
          {children}
          {typed && <LeaveGuard what={title} />}
        </div>
      )}
    </dialog>
  );
}

/** Asks before a navigation discards what was typed in an open dialog. Rendered only then: a router holds one blocker at a time. */
function LeaveGuard({ what }: { what: string }) {
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      !(nextLocation.state as { sentFromDialog?: boolean } | null)?.sentFromDialog &&
      (currentLocation.pathname !== nextLocation.pathname || currentLocation.search !== nextLocation.search),
  );
  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);
  const ref = useRef<HTMLDialogElement>(null);
  const blocked = blocker.state === 'blocked';
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (blocked && dialog && !dialog.open) dialog.showModal();
    if (!blocked && dialog?.open) dialog.close();
  }, [blocked]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(event) => {
        event.preventDefault();
        blocker.reset?.();
      }}
      className="m-auto w-full max-w-md rounded-xl border border-ink/10 bg-paper p-5 text-ink shadow-2xl backdrop:bg-ink/50"
    >
      {blocked && (
        <>
          <h2 id={titleId} className="mb-3 text-lg font-bold">
            Leave without sending?
          </h2>
          <p className="text-sm text-ink-soft">What you typed in “{what}” is not sent yet and will be lost.</p>
          <div className="mt-5 flex justify-end gap-2">
            <Button variant="secondary" onClick={() => blocker.reset?.()}>
              Stay and keep it
            </Button>
            <Button variant="danger" onClick={() => blocker.proceed?.()}>
              Leave and discard
            </Button>
          </div>
        </>
      )}
    </dialog>
  );
}
