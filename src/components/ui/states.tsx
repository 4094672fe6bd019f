import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { errorMessage } from '../../lib/api-client';
import { Button } from './button';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" data-state="loading" className="flex items-center gap-3 py-bay text-hull-500">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-hull-200 border-t-brass-500" aria-hidden />
      {label}
    </div>
  );
}

export function ErrorState({ error, onRetry, title = 'This could not be loaded' }: { error: unknown; onRetry?: () => void; title?: string }) {
  return (
    <div role="alert" data-state="error" className="rounded-plate border border-signal-100 bg-signal-50 px-gutter py-4">
      <p className="font-semibold text-signal-700">{title}</p>
      <p className="mt-1 text-small text-signal-700">{errorMessage(error)}</p>
      {onRetry ? (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}

/** Says that there is nothing yet and what to do next. */
export function EmptyState({ title, next, action }: { title: string; next: ReactNode; action?: ReactNode }) {
  return (
    <div data-state="empty" className="rounded-plate border border-dashed border-deck-300 bg-white px-gutter py-bay text-center">
      <p className="text-lead font-semibold text-hull-800">{title}</p>
      <p className="mx-auto mt-1 max-w-form text-small text-hull-600">{next}</p>
      {action ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}

interface QueryViewProps<T> {
  query: UseQueryResult<T>;
  /** When it returns true the empty state shows instead of the children. */
  isEmpty?: (data: T) => boolean;
  empty?: ReactNode;
  loadingLabel?: string;
  children: (data: T) => ReactNode;
}

/** Loading, error, empty or the data, for one query. */
export function QueryView<T>({ query, isEmpty, empty, loadingLabel, children }: QueryViewProps<T>) {
  if (query.isPending) return <LoadingState label={loadingLabel} />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  if (isEmpty?.(query.data) && empty) return <>{empty}</>;
  return <>{children(query.data)}</>;
}
