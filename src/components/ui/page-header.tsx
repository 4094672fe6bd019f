import type { ReactNode } from 'react';

/** The page's one <h1>, an optional line under it and actions at the right. */
export function PageHeader({ title, description, actions }: { title: string; description?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-deck-200 pb-4">
      <div>
        <h1>{title}</h1>
        {description ? <p className="mt-1 text-body text-hull-600">{description}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </header>
  );
}
