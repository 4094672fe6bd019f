import { useEffect } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Field, Input } from '../../../components/ui/form-field';

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const MONTH = /^\d{4}-(0[1-9]|1[0-2])$/;

/** The calendar month before the one of `now`, as YYYY-MM (UTC: log dates are ship's days). */
export function previousMonth(now: Date = new Date()): string {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
}

/** First and last date (inclusive) of a month YYYY-MM. */
export function monthBounds(month: string): { from: string; to: string } {
  const [y, m] = month.split('-').map(Number);
  return { from: `${month}-01`, to: new Date(Date.UTC(y, m, 0)).toISOString().slice(0, 10) };
}

/**
 * The month a page opens on when its address names none: the month of the latest logged day when one is known (so
 * a vessel whose logs stop before last month does not open on an empty page), else the previous calendar month.
 */
export function defaultMonth(latestLogDate?: string | null, now: Date = new Date()): string {
  return latestLogDate && DATE.test(latestLogDate) ? latestLogDate.slice(0, 7) : previousMonth(now);
}

/** The latest of some log dates (YYYY-MM-DD sort as text), or null when none is logged. */
export function latestDate(dates: readonly (string | null | undefined)[]): string | null {
  return dates.reduce<string | null>((latest, d) => (d && (!latest || d > latest) ? d : latest), null);
}

/**
 * The period of a page, kept in the address (?from=&to=) so it can be shared and reloaded; the month of the latest
 * logged day (or the previous full month) when the address names none.
 */
export function usePeriodParam(latestLogDate?: string | null): [{ from: string; to: string }, (next: { from: string; to: string }) => void] {
  const [params, setParams] = useSearchParams();
  const fallback = monthBounds(defaultMonth(latestLogDate));
  const from = params.get('from') ?? '';
  const to = params.get('to') ?? '';
  const named = DATE.test(from) && DATE.test(to);
  const period = named ? { from, to } : fallback;
  // Write the default into the address, so the page can be shared or reloaded on the same period.
  useEffect(() => {
    if (!named) setParams((p) => ({ ...Object.fromEntries(p), from: fallback.from, to: fallback.to }), { replace: true });
  }, [named, fallback.from, fallback.to, setParams]);
  return [period, (next) => setParams((p) => ({ ...Object.fromEntries(p), from: next.from, to: next.to }), { replace: true })];
}

/**
 * The month of a report page, kept in the address (?month=YYYY-MM); by default the month of the latest logged day,
 * or the previous full month when no day is logged.
 */
export function useMonthParam(latestLogDate?: string | null): [string, (month: string) => void] {
  const [params, setParams] = useSearchParams();
  const month = params.get('month') ?? '';
  const named = MONTH.test(month);
  const fallback = defaultMonth(latestLogDate);
  useEffect(() => {
    if (!named) setParams((p) => ({ ...Object.fromEntries(p), month: fallback }), { replace: true });
  }, [named, fallback, setParams]);
  return [named ? month : fallback, (next) => setParams((p) => ({ ...Object.fromEntries(p), month: next }), { replace: true })];
}

/** From / to date inputs of a period (hidden in print). */
export function PeriodPicker({ period, onChange, idPrefix }: { period: { from: string; to: string }; onChange: (p: { from: string; to: string }) => void; idPrefix: string }) {
  return (
    <div className="flex flex-wrap items-end gap-3 print:hidden">
      <Field label="From" htmlFor={`${idPrefix}-from`}>
        <Input id={`${idPrefix}-from`} type="date" value={period.from} max={period.to} onChange={(e) => DATE.test(e.target.value) && onChange({ ...period, from: e.target.value })} />
      </Field>
      <Field label="To" htmlFor={`${idPrefix}-to`}>
        <Input id={`${idPrefix}-to`} type="date" value={period.to} min={period.from} onChange={(e) => DATE.test(e.target.value) && onChange({ ...period, to: e.target.value })} />
      </Field>
    </div>
  );
}

/** A month input (YYYY-MM; hidden in print). */
export function MonthPicker({ month, onChange, id }: { month: string; onChange: (month: string) => void; id: string }) {
  return (
    <div className="print:hidden">
      <Field label="Month" htmlFor={id}>
        <Input id={id} type="month" value={month} onChange={(e) => MONTH.test(e.target.value) && onChange(e.target.value)} className="w-48" />
      </Field>
    </div>
  );
}
