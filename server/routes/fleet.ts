import { Router } from 'express';
import type { AppDeps } from '../context';
import { idParam } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { getFleetBenchmark, getVesselBenchmark } from '../services/fleet';

/**
 * Fleet benchmarking over ?from=&to=: the fleet for superintendents, energy officers and admins ('reports:read');
 * one vessel's rows for every member who may see that vessel (chief engineers: their own).
 */
export function fleetRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/fleet/benchmark', requireCapability('reports:read'), async (req, res) => {
    res.json(await getFleetBenchmark(deps, actorOf(req), req.query));
  });
  r.get('/vessels/:vesselId/benchmark', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getVesselBenchmark(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), req.query));
  });
  return r;
}
