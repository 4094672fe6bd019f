import { z } from 'zod';

/** Query of the monthly report routes: ?month=YYYY-MM. */
export const reportQuerySchema = z.object({
  month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Use a month YYYY-MM'),
});
export type ReportQuery = z.infer<typeof reportQuerySchema>;

export type ReportCell = string | number | null;

/** One table of a report; each header names its unit. */
export interface ReportTable {
  title: string;
  headers: string[];
  rows: ReportCell[][];
}

/** A monthly report of one vessel or of the fleet: the same content on the page, in CSV and in XLSX. */
export interface MonthlyReport {
  kind: 'vessel' | 'fleet';
  title: string;
  companyName: string;
  vesselId: string | null;
  month: string;
  from: string;
  to: string;
  generatedAt: string;
  currency: string;
  /** Key figures: label (with unit) and value text. */
  summary: { label: string; value: string }[];
  tables: ReportTable[];
  warnings: string[];
  method: string[];
  caution: string;
}

export const SUBSCRIPTION_KINDS = ['vessel_monthly_report', 'fleet_monthly_report', 'drift_alert', 'overhaul_alert'] as const;
export const subscriptionKindSchema = z.enum(SUBSCRIPTION_KINDS);
export type SubscriptionKind = z.infer<typeof subscriptionKindSchema>;

export const SUBSCRIPTION_LABELS: Record<SubscriptionKind, string> = {
  vessel_monthly_report: 'Monthly report of a vessel',
  fleet_monthly_report: 'Monthly fleet report',
  drift_alert: 'SFOC drift alerts',
  overhaul_alert: 'Overhaul-due alerts',
};

export const subscriptionInputSchema = z
  .object({
    kind: subscriptionKindSchema,
    /** null: every vessel the user may see (required for a vessel report, not allowed for the fleet report). */
    vesselId: z.uuid().nullable().default(null),
    hoursBefore: z.number().min(0).max(100_000).nullable().default(null),
  })
  .refine((s) => s.kind !== 'vessel_monthly_report' || s.vesselId !== null, { message: 'Choose the vessel', path: ['vesselId'] })
  .refine((s) => s.kind !== 'fleet_monthly_report' || s.vesselId === null, { message: 'The fleet report covers every vessel', path: ['vesselId'] })
  .refine((s) => s.kind === 'overhaul_alert' || s.hoursBefore === null, { message: 'Only overhaul alerts take hours before', path: ['hoursBefore'] });
export type SubscriptionInput = z.input<typeof subscriptionInputSchema>;

export interface SubscriptionRow {
  id: string;
  kind: SubscriptionKind;
  vesselId: string | null;
  vesselName: string | null;
  hoursBefore: number | null;
  createdAt: string;
  lastDeliveredAt: string | null;
}
