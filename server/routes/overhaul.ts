import { Router } from 'express';
import { maintenanceEventInputSchema, staggerInputSchema, workWindowInputSchema } from '../../shared/schemas/overhaul';
import type { AppDeps } from '../context';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import {
  createWorkWindow,
  deleteWorkWindow,
  getFleetOverhaul,
  getVesselOverhaul,
  listMaintenanceEvents,
  listWorkWindows,
  recordMaintenanceEvent,
  updateWorkWindow,
} from '../services/overhaul';
import { checkOverhaulAlerts } from '../services/overhaul-alerts';
import { approveHourBudgetPlan, listHourBudgetPlans, previewStagger, saveHourBudgetPlan } from '../services/overhaul-stagger';

/**
 * Running hours and overhaul planning: due dates per vessel and fleet, work windows, completed work, stagger
 * advice and hour-budget plans, and the admin trigger of the overhaul-alert check.
 */
export function overhaulRouter(deps: AppDeps): Router {
  const r = Router();
  const vessel = (v: string | string[] | undefined) => idParam(v, 'Vessel');

  r.get('/fleet/overhaul', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getFleetOverhaul(deps, actorOf(req), req.query));
  });

  r.get('/vessels/:vesselId/overhaul', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getVesselOverhaul(deps, actorOf(req), vessel(req.params.vesselId), req.query));
  });

  r.get('/vessels/:vesselId/work-windows', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listWorkWindows(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.post('/vessels/:vesselId/work-windows', requireCapability('overhaul:plan'), async (req, res) => {
    const input = parseBody(workWindowInputSchema, req.body, 'work window');
    res.status(201).json(await createWorkWindow(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.patch('/vessels/:vesselId/work-windows/:windowId', requireCapability('overhaul:plan'), async (req, res) => {
    const input = parseBody(workWindowInputSchema, req.body, 'work window');
    res.json(await updateWorkWindow(deps, actorOf(req), vessel(req.params.vesselId), idParam(req.params.windowId, 'Work window'), input));
  });

  r.delete('/vessels/:vesselId/work-windows/:windowId', requireCapability('overhaul:plan'), async (req, res) => {
    await deleteWorkWindow(deps, actorOf(req), vessel(req.params.vesselId), idParam(req.params.windowId, 'Work window'));
    res.status(204).end();
  });

  r.get('/vessels/:vesselId/maintenance-events', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listMaintenanceEvents(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.post('/vessels/:vesselId/maintenance-events', requireCapability('overhaul:record'), async (req, res) => {
    const input = parseBody(maintenanceEventInputSchema, req.body, 'completed work');
    res.status(201).json(await recordMaintenanceEvent(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.post('/vessels/:vesselId/overhaul/stagger', requireCapability('overhaul:plan'), async (req, res) => {
    const input = parseBody(staggerInputSchema, req.body, 'stagger request');
    res.json(await previewStagger(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.get('/vessels/:vesselId/hour-budgets', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listHourBudgetPlans(deps, actorOf(req), vessel(req.params.vesselId)));
  });

  r.post('/vessels/:vesselId/hour-budgets', requireCapability('overhaul:plan'), async (req, res) => {
    const input = parseBody(staggerInputSchema, req.body, 'stagger request');
    res.status(201).json(await saveHourBudgetPlan(deps, actorOf(req), vessel(req.params.vesselId), input));
  });

  r.post('/vessels/:vesselId/hour-budgets/:planId/approve', requireCapability('overhaul:plan'), async (req, res) => {
    res.json(await approveHourBudgetPlan(deps, actorOf(req), vessel(req.params.vesselId), idParam(req.params.planId, 'Hour-budget plan')));
  });

  // Runs the overhaul-alert check of the admin's company now (the server also runs it for all companies).
  r.post('/overhaul/alerts/check', requireCapability('company:settings'), async (req, res) => {
    res.json(await checkOverhaulAlerts(deps, deps.now(), { companyId: actorOf(req).companyId }));
  });

  return r;
}
