import { Router } from 'express';
import { z } from 'zod';
import { gensetStatusInputSchema, operatingModeSchema, operatingRuleInputSchema, singlePointInputSchema } from '../../shared/schemas/recommendations';
import type { AppDeps } from '../context';
import { AppError } from '../errors';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import {
  currentGuideline,
  getGuidelineVersion,
  getOperatingRules,
  getPlantModel,
  listGuidelines,
  putOperatingRule,
  recommendAtPoint,
  setGensetStatus,
} from '../services/recommendations';

const versionParam = z.coerce.number().int().positive();

function modeParam(value: string | string[] | undefined) {
  const parsed = operatingModeSchema.safeParse(Array.isArray(value) ? value[0] : value);
  if (!parsed.success) throw new AppError('not_found', 'Operating mode not found');
  return parsed.data;
}

/** Operating rules, set status, plant model, one operating point and the operating guideline of a vessel. */
export function recommendationsRouter(deps: AppDeps): Router {
  const r = Router();
  const vessel = (v: string | string[] | undefined) => idParam(v, 'Vessel');

  r.get('/vessels/:vesselId/operating-rules', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getOperatingRules(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.put('/vessels/:vesselId/operating-rules/:mode', requireCapability('plant:edit'), async (req, res) => {
    const input = parseBody(operatingRuleInputSchema, req.body, 'operating rule');
    res.json(await putOperatingRule(deps, actorOf(req), vessel(req.params.vesselId), modeParam(req.params.mode), input));
  });

  r.put('/vessels/:vesselId/gensets/:gensetId/status', requireCapability('plant:status'), async (req, res) => {
    const input = parseBody(gensetStatusInputSchema, req.body, 'set status');
    res.json(await setGensetStatus(deps, actorOf(req), vessel(req.params.vesselId), idParam(req.params.gensetId, 'Genset'), input));
  });

  r.get('/vessels/:vesselId/plant-model', requireCapability('recommendations:run'), async (req, res) => {
    res.json(await getPlantModel(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.post('/vessels/:vesselId/recommendations', requireCapability('recommendations:run'), async (req, res) => {
    const input = parseBody(singlePointInputSchema, req.body, 'operating point');
    res.json(await recommendAtPoint(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.post('/vessels/:vesselId/guidelines/current', requireCapability('recommendations:run'), async (req, res) => {
    res.json(await currentGuideline(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.get('/vessels/:vesselId/guidelines', requireCapability('recommendations:run'), async (req, res) => {
    res.json(await listGuidelines(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.get('/vessels/:vesselId/guidelines/:version', requireCapability('recommendations:run'), async (req, res) => {
    const v = versionParam.safeParse(req.params.version);
    if (!v.success) throw new AppError('not_found', 'Guideline not found');
    res.json(await getGuidelineVersion(deps, actorOf(req), vessel(req.params.vesselId), v.data));
  });

  return r;
}
