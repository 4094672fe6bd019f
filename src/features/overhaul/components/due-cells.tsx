import type { MaintenanceDue } from '../../../../shared/schemas/overhaul';
import { Badge } from '../../../components/ui/badge';
import { formatDate, formatHours } from '../../../lib/format';

/** Hours left with its state: overdue, within the alert range, or plenty. */
export function HoursLeft({ item }: { item: Pick<MaintenanceDue, 'hoursLeft' | 'overdue'> }) {
  if (item.overdue) return <Badge tone="bad">overdue {item.hoursLeft < 0 ? `by ${formatHours(-item.hoursLeft)}` : ''}</Badge>;
  return <span className="figures">{formatHours(item.hoursLeft)}</span>;
}

const GOVERNED: Record<NonNullable<MaintenanceDue['governedBy']>, string> = { hours: 'by running hours', months: 'by calendar months', both: 'hours and months agree' };

/** The due date, what sets it, and the window it falls in (by its place). */
export function DueDate({ item, windowPlace }: { item: MaintenanceDue; windowPlace?: string | null }) {
  if (!item.dueDate) return <span className="text-hull-500">not reached at this usage</span>;
  return (
    <span>
      <span className="figures">{formatDate(item.dueDate)}</span>
      <span className="block text-caption text-hull-500">
        {item.governedBy ? GOVERNED[item.governedBy] : ''}
        {item.daysLeft !== null ? ` · ${item.daysLeft} days` : ''}
        {windowPlace ? ` · in ${windowPlace}` : item.windowId === null ? ' · no window' : ''}
      </span>
    </span>
  );
}
