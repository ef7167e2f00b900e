import type { ReactNode } from 'react';

/** A titled block of an office page. */
export function Panel({ title, actions, children, id }: { title: string; actions?: ReactNode; children: ReactNode; id?: string }) {
  return (
    <section aria-labelledby={id ?? undefined} aria-label={id ? undefined : title} className="rounded border border-ink/20 bg-white p-4">
      <div className="mb-3 flex items-center gap-3">
        <h2 id={id} className="text-lg font-bold">
          {title}
        </h2>
        {actions && <div className="ml-auto flex gap-2">{actions}</div>}
      </div>
      {children}
    </section>
  );
}
