import { Router } from 'express';
import type { AppDeps } from '../context';
import { idParam } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { getVesselSavings } from '../services/savings';

/** Savings of one vessel: ?from=YYYY-MM-DD&to=YYYY-MM-DD(&level=0.95). Every member who may see the vessel. */
export function savingsRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/vessels/:vesselId/savings', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getVesselSavings(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), req.query));
  });
  return r;
}
