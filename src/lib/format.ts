// Every number the client shows goes through one of these, so it always carries its unit.

const grouped = (digits: number) => new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
const fixed = (digits: number) => new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits });

const NBSP = '\u00a0';

function withUnit(value: number | null | undefined, unit: string, format: Intl.NumberFormat): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return `${format.format(value)}${NBSP}${unit}`;
}

export const formatKw = (v: number | null | undefined) => withUnit(v, 'kW', grouped(0));
export const formatKva = (v: number | null | undefined) => withUnit(v, 'kVA', grouped(0));
export const formatSfoc = (v: number | null | undefined) => withUnit(v, 'g/kWh', fixed(1));
export const formatPct = (v: number | null | undefined) => withUnit(v, '%', grouped(1));
export const formatHours = (v: number | null | undefined) => withUnit(v, 'h', grouped(0));
export const formatVolts = (v: number | null | undefined) => withUnit(v, 'V', grouped(0));
export const formatHz = (v: number | null | undefined) => withUnit(v, 'Hz', grouped(0));
export const formatKg = (v: number | null | undefined) => withUnit(v, 'kg', grouped(1));
export const formatTonnes = (v: number | null | undefined) => withUnit(v, 't', fixed(2));

/** "12 Mar 2025" for a calendar date or a timestamp (shown in UTC: log dates are ship's days, not local days). */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '–';
  const d = new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  if (Number.isNaN(d.getTime())) return iso;
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(d);
}

/** "12 Mar 2025, 14:05 UTC" for a timestamp. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '–';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const text = new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZone: 'UTC',
  }).format(d);
  return `${text} UTC`;
}
