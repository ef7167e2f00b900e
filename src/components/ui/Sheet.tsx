// A full-screen sheet for one task (a reading, a finding): title and close at the top, the
// primary action pinned to the bottom where the thumb is.
import { useEffect, useRef, type ReactNode } from 'react';

type Props = { title: string; onClose: () => void; footer?: ReactNode; children: ReactNode; closeLabel?: string };

export function Sheet({ title, onClose, footer, children, closeLabel = 'Close' }: Props) {
  const ref = useRef<HTMLDivElement>(null);
  const close = useRef(onClose);
  close.current = onClose;
  // Once per opening: a parent re-rendering (a sync landing) must not pull focus out of a field.
  useEffect(() => {
    ref.current?.focus();
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') close.current();
    };
    document.addEventListener('keydown', onKey);
    const overflow = document.body.style.overflow;
    document.body.style.overflow = 'hidden';
    return () => {
      document.removeEventListener('keydown', onKey);
      document.body.style.overflow = overflow;
    };
  }, []);

  return (
    <div role="dialog" aria-modal="true" aria-label={title} className="fixed inset-0 z-40 flex justify-center bg-ink/40">
      <div ref={ref} tabIndex={-1} className="flex h-full w-full max-w-xl flex-col bg-paper outline-none">
        <div className="flex min-h-16 items-center gap-2 border-b-2 border-ink/15 bg-white px-3">
          <h2 className="min-w-0 flex-1 text-xl font-bold leading-tight">{title}</h2>
          <button type="button" onClick={onClose} className="min-h-12 min-w-12 rounded-lg border-2 border-ink/40 px-3 font-bold">
            {closeLabel}
          </button>
        </div>
        <div className="flex-1 overflow-y-auto p-3">{children}</div>
        {footer && <div className="border-t-2 border-ink/15 bg-white p-3">{footer}</div>}
      </div>
    </div>
  );
}
