import { Router, type Response } from 'express';
import type { MonthlyReport } from '../../shared/schemas/reports';
import type { AppDeps } from '../context';
import { notFound } from '../errors';
import { idParam } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { getFleetReport, getVesselReport, reportCsv, reportFileName, reportXlsx } from '../services/reports';

const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

function formatOf(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

async function send(res: Response, report: MonthlyReport, format: string | undefined): Promise<void> {
  if (format === 'csv') {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${reportFileName(report, 'csv')}"`);
    res.send(reportCsv(report));
  } else if (format === 'xlsx') {
    res.setHeader('Content-Type', XLSX_TYPE);
    res.setHeader('Content-Disposition', `attachment; filename="${reportFileName(report, 'xlsx')}"`);
    res.send(await reportXlsx(report));
  } else if (format === undefined) {
    res.json(report);
  } else {
    throw notFound('Report format');
  }
}

/**
 * Monthly reports (?month=YYYY-MM): a vessel's for every member who may see it, the fleet's for 'reports:read'.
 * `/monthly.csv` and `/monthly.xlsx` download the same content.
 */
export function reportsRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/fleet/reports/monthly{.:format}', requireCapability('reports:read'), async (req, res) => {
    await send(res, await getFleetReport(deps, actorOf(req), req.query), formatOf(req.params.format));
  });
  r.get('/vessels/:vesselId/reports/monthly{.:format}', requireCapability('fleet:read'), async (req, res) => {
    await send(res, await getVesselReport(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), req.query), formatOf(req.params.format));
  });
  return r;
}
