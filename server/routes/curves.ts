import { Router } from 'express';
import type { AppDeps } from '../context';
import { curveQuerySchema } from '../../shared/schemas/curves';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { getFleetDriftAlerts, getSetCurve, getVesselDriftAlerts, listVesselCurves } from '../services/curves';

/**
 * Fuel curves per genset and drift alerts. Query of the curve routes: ?window=since_overhaul|rolling_90|
 * rolling_180|rolling_365|custom (&from=&to= for custom); parsed with the shared schema.
 */
export function curvesRouter(deps: AppDeps): Router {
  const r = Router();

  r.get('/curves/alerts', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getFleetDriftAlerts(deps, actorOf(req)));
  });

  r.get('/vessels/:vesselId/curves', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listVesselCurves(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), parseBody(curveQuerySchema, req.query, 'curve window')));
  });

  r.get('/vessels/:vesselId/curves/alerts', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getVesselDriftAlerts(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel')));
  });

  r.get('/vessels/:vesselId/curves/:gensetId', requireCapability('fleet:read'), async (req, res) => {
    res.json(
      await getSetCurve(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), idParam(req.params.gensetId, 'Genset'), parseBody(curveQuerySchema, req.query, 'curve window')),
    );
  });

  return r;
}
