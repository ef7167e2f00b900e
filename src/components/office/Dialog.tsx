// A modal dialog on the native <dialog> element: the browser traps focus and Escape closes it.
import { useEffect, useId, useRef, type ReactNode } from 'react';

export function Dialog({ open, title, onClose, children, wide }: { open: boolean; title: string; onClose: () => void; children: ReactNode; wide?: boolean }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
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
      aria-labelledby={titleId}
      className={`m-auto rounded-lg border border-ink/30 bg-paper p-0 text-ink shadow-2xl backdrop:bg-ink/40 ${wide ? 'w-[min(960px,95vw)]' : 'w-[min(640px,95vw)]'}`}
    >
      {open && (
        <div className="flex max-h-[90vh] flex-col">
          <div className="flex items-center gap-3 border-b border-ink/20 bg-white px-5 py-3">
            <h2 id={titleId} className="text-xl font-bold">
              {title}
            </h2>
            <button type="button" onClick={onClose} className="ml-auto min-h-10 rounded border border-ink/40 px-3 font-bold" aria-label="Close">
              Close
            </button>
          </div>
          <div className="overflow-y-auto px-5 py-4">{children}</div>
        </div>
      )}
    </dialog>
  );
}
