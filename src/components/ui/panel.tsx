import type { ReactNode } from 'react';

/** A titled white plate that groups one part of a page. */
export function Panel({ title, actions, children, className = '' }: { title?: string; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-plate border border-deck-200 bg-white shadow-plate ${className}`}>
      {title || actions ? (
        <div className="flex flex-wrap items-center justify-between gap-3 border-b border-deck-100 px-gutter py-3">
          {title ? <h2 className="text-lead font-semibold">{title}</h2> : <span />}
          {actions}
        </div>
      ) : null}
      <div className="px-gutter py-4">{children}</div>
    </section>
  );
}
