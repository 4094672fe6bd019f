import { z } from 'zod';
import type { MonthlyReport } from '../../../../shared/schemas/reports';

export type ReportFormat = 'csv' | 'xlsx';

/** Shallow check of a monthly report answer (the full type is the shared MonthlyReport). */
export const monthlyReportSchema = z.custom<MonthlyReport>(
  (v) => typeof v === 'object' && v !== null && Array.isArray((v as { tables?: unknown }).tables) && Array.isArray((v as { method?: unknown }).method) && typeof (v as { caution?: unknown }).caution === 'string',
);
