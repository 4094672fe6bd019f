import { Router } from 'express';
import { historyProfileInputSchema, planInputSchema } from '../../shared/schemas/plans';
import type { AppDeps } from '../context';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { approvePlan, createPlan, getPlan, historyProfile, listPlans, resolvePlan } from '../services/plans';

/** Voyage plans of a vessel: create (solved in a worker thread), poll, re-solve, approve; profile from history. */
export function plansRouter(deps: AppDeps): Router {
  const r = Router();
  const vessel = (v: string | string[] | undefined) => idParam(v, 'Vessel');
  const plan = (v: string | string[] | undefined) => idParam(v, 'Plan');

  r.get('/vessels/:vesselId/plans', requireCapability('recommendations:run'), async (req, res) => {
    res.json(await listPlans(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.post('/vessels/:vesselId/plans', requireCapability('recommendations:run'), async (req, res) => {
    const input = parseBody(planInputSchema, req.body, 'voyage plan');
    res.status(202).json(await createPlan(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.post('/vessels/:vesselId/plans/profile-from-history', requireCapability('recommendations:run'), async (req, res) => {
    const input = parseBody(historyProfileInputSchema, req.body, 'history profile');
    res.json(await historyProfile(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.get('/vessels/:vesselId/plans/:planId', requireCapability('recommendations:run'), async (req, res) => {
    res.json(await getPlan(deps, actorOf(req), vessel(req.params.vesselId), plan(req.params.planId)));
  });

  r.post('/vessels/:vesselId/plans/:planId/resolve', requireCapability('recommendations:run'), async (req, res) => {
    res.status(202).json(await resolvePlan(deps, actorOf(req), vessel(req.params.vesselId), plan(req.params.planId)));
  });

  r.post('/vessels/:vesselId/plans/:planId/approve', requireCapability('plans:approve'), async (req, res) => {
    res.json(await approvePlan(deps, actorOf(req), vessel(req.params.vesselId), plan(req.params.planId)));
  });

  return r;
}
