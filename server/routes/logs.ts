import { Router, type Request } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  commitOptionsSchema,
  exclusionInputSchema,
  fuelLotInputSchema,
  INTAKE_LIMITS,
  logEntryInputSchema,
  logListQuerySchema,
  meterReplacementInputSchema,
  modeHoursInputSchema,
  previewOptionsSchema,
} from '../../shared/schemas/logs';
import type { AppDeps } from '../context';
import { AppError } from '../errors';
import { writeCsv } from '../lib/csv';
import { TEMPLATE_HEADERS } from '../lib/csv-mapping';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { vesselForActor } from '../services/access';
import { createLog, createReplacement, deleteLog, deleteModeHours, deleteReplacement, exportLogs, listLogs, listModeHours, listReplacements, putModeHours, setExclusion, updateLog } from '../services/logs-entries';
import { createFuelLot, getAttachment, listFuelLots, putAttachment, updateFuelLot } from '../services/logs-fuel-lots';
import { listImports, undoImport } from '../services/logs-history';
import { commitUpload, listMappings, previewUpload } from '../services/logs-intake';
import { loadVesselLogContext } from '../services/logs-data';

const csvUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: INTAKE_LIMITS.csvMaxBytes, files: 1, fields: 5 } }).single('file');
const attachmentUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: INTAKE_LIMITS.attachmentMaxBytes, files: 1, fields: 2 } }).single('file');

/** The JSON `options` field of a multipart request. */
function optionsField(req: Request): unknown {
  const raw = (req.body as Record<string, unknown> | undefined)?.options;
  if (raw === undefined || raw === '') return {};
  if (typeof raw !== 'string') throw new AppError('bad_request', 'The options field must be JSON text');
  try {
    return JSON.parse(raw);
  } catch {
    throw new AppError('bad_request', 'The options field is not valid JSON', [{ path: 'options', message: 'Not JSON' }]);
  }
}

const rangeQuery = z.object({ gensetId: z.uuid().optional(), from: z.iso.date().optional(), to: z.iso.date().optional() });
const dateParam = z.iso.date();

function dayParam(value: string | string[] | undefined): string {
  const parsed = dateParam.safeParse(Array.isArray(value) ? value[0] : value);
  if (!parsed.success) throw new AppError('not_found', 'Day not found');
  return parsed.data;
}

function sendCsv(res: import('express').Response, fileName: string, csv: string) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^\w.-]/g, '_')}"`);
  res.send(`\uFEFF${csv}`);
}

/** Engine-room logs of a vessel: intake, table, manual entry, history, meter replacements, mode hours, fuel lots. */
export function logsRouter(deps: AppDeps): Router {
  const r = Router();
  const vid = (req: Request) => idParam(req.params.vesselId, 'Vessel');

  // Log table, export, template, manual entry.
  r.get('/:vesselId/logs', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listLogs(deps, actorOf(req), vid(req), parseBody(logListQuerySchema, req.query, 'query')));
  });
  r.get('/:vesselId/logs/export.csv', requireCapability('fleet:read'), async (req, res) => {
    const { fileName, csv } = await exportLogs(deps, actorOf(req), vid(req), parseBody(rangeQuery, req.query, 'query'));
    sendCsv(res, fileName, csv);
  });
  r.get('/:vesselId/logs/template.csv', requireCapability('fleet:read'), async (req, res) => {
    const vesselId = vid(req);
    await vesselForActor(deps.db, actorOf(req), vesselId);
    const { sets } = await loadVesselLogContext(deps.db, vesselId);
    const example = (sets.length ? sets : [{ designation: 'DG1' }]).map((s) => [new Date(deps.now()).toISOString().slice(0, 10), s.designation, ...TEMPLATE_HEADERS.slice(2).map(() => '')]);
    sendCsv(res, 'kilowatch-log-template.csv', writeCsv(TEMPLATE_HEADERS, example));
  });
  r.get('/:vesselId/logs/mappings', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listMappings(deps, actorOf(req), vid(req)));
  });
  r.post('/:vesselId/logs/preview', requireCapability('logs:edit'), csvUpload, async (req, res) => {
    const options = parseBody(previewOptionsSchema, optionsField(req), 'options');
    res.json(await previewUpload(deps, actorOf(req), vid(req), req.file, options.mapping));
  });
  r.post('/:vesselId/logs/commit', requireCapability('logs:edit'), csvUpload, async (req, res) => {
    const options = parseBody(commitOptionsSchema, optionsField(req), 'options');
    res.status(201).json(await commitUpload(deps, actorOf(req), vid(req), req.file, options));
  });
  r.post('/:vesselId/logs', requireCapability('logs:edit'), async (req, res) => {
    res.status(201).json(await createLog(deps, actorOf(req), vid(req), parseBody(logEntryInputSchema, req.body, 'log entry')));
  });
  r.patch('/:vesselId/logs/:logId', requireCapability('logs:edit'), async (req, res) => {
    res.json(await updateLog(deps, actorOf(req), vid(req), idParam(req.params.logId, 'Log entry'), parseBody(logEntryInputSchema, req.body, 'log entry')));
  });
  r.delete('/:vesselId/logs/:logId', requireCapability('logs:edit'), async (req, res) => {
    await deleteLog(deps, actorOf(req), vid(req), idParam(req.params.logId, 'Log entry'));
    res.status(204).end();
  });
  r.post('/:vesselId/logs/:logId/exclusion', requireCapability('logs:edit'), async (req, res) => {
    res.json(await setExclusion(deps, actorOf(req), vid(req), idParam(req.params.logId, 'Log entry'), parseBody(exclusionInputSchema, req.body, 'exclusion')));
  });

  // Import history.
  r.get('/:vesselId/log-imports', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listImports(deps, actorOf(req), vid(req)));
  });
  r.post('/:vesselId/log-imports/:importId/undo', requireCapability('logs:edit'), async (req, res) => {
    res.json(await undoImport(deps, actorOf(req), vid(req), idParam(req.params.importId, 'Import')));
  });

  // Meter replacements.
  r.get('/:vesselId/meter-replacements', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listReplacements(deps, actorOf(req), vid(req)));
  });
  r.post('/:vesselId/meter-replacements', requireCapability('logs:edit'), async (req, res) => {
    res.status(201).json(await createReplacement(deps, actorOf(req), vid(req), parseBody(meterReplacementInputSchema, req.body, 'meter replacement')));
  });
  r.delete('/:vesselId/meter-replacements/:id', requireCapability('logs:edit'), async (req, res) => {
    await deleteReplacement(deps, actorOf(req), vid(req), idParam(req.params.id, 'Meter replacement'));
    res.status(204).end();
  });

  // Operating-mode hours.
  r.get('/:vesselId/mode-hours', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listModeHours(deps, actorOf(req), vid(req), parseBody(rangeQuery, req.query, 'query')));
  });
  r.put('/:vesselId/mode-hours/:date', requireCapability('logs:edit'), async (req, res) => {
    res.json(await putModeHours(deps, actorOf(req), vid(req), dayParam(req.params.date), parseBody(modeHoursInputSchema, req.body, 'mode hours')));
  });
  r.delete('/:vesselId/mode-hours/:date', requireCapability('logs:edit'), async (req, res) => {
    await deleteModeHours(deps, actorOf(req), vid(req), dayParam(req.params.date));
    res.status(204).end();
  });

  // Fuel lots.
  r.get('/:vesselId/fuel-lots', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listFuelLots(deps, actorOf(req), vid(req)));
  });
  r.post('/:vesselId/fuel-lots', requireCapability('logs:edit'), async (req, res) => {
    res.status(201).json(await createFuelLot(deps, actorOf(req), vid(req), parseBody(fuelLotInputSchema, req.body, 'fuel lot')));
  });
  r.patch('/:vesselId/fuel-lots/:lotId', requireCapability('logs:edit'), async (req, res) => {
    res.json(await updateFuelLot(deps, actorOf(req), vid(req), idParam(req.params.lotId, 'Fuel lot'), parseBody(fuelLotInputSchema, req.body, 'fuel lot')));
  });
  r.put('/:vesselId/fuel-lots/:lotId/attachment', requireCapability('logs:edit'), attachmentUpload, async (req, res) => {
    res.json(await putAttachment(deps, actorOf(req), vid(req), idParam(req.params.lotId, 'Fuel lot'), req.file));
  });
  r.get('/:vesselId/fuel-lots/:lotId/attachment', requireCapability('fleet:read'), async (req, res) => {
    const file = await getAttachment(deps, actorOf(req), vid(req), idParam(req.params.lotId, 'Fuel lot'));
    res.setHeader('Content-Type', file.type);
    res.setHeader('Content-Disposition', `attachment; filename="${file.name.replace(/[^\w.-]/g, '_')}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(file.data);
  });

  return r;
}
