import { Router } from 'express';
import { fuelPriceInputSchema } from '../../shared/schemas/savings';
import type { AppDeps } from '../context';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { deleteFuelPrice, listFuelPrices, putFuelPrice } from '../services/fuel-prices';

/** Company fuel prices per grade: every member reads them (savings are costed with them); an admin edits them. */
export function fuelPricesRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/fuel-prices', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listFuelPrices(deps, actorOf(req)));
  });
  r.put('/fuel-prices', requireCapability('company:settings'), async (req, res) => {
    res.json(await putFuelPrice(deps, actorOf(req), parseBody(fuelPriceInputSchema, req.body, 'fuel price')));
  });
  r.delete('/fuel-prices/:priceId', requireCapability('company:settings'), async (req, res) => {
    await deleteFuelPrice(deps, actorOf(req), idParam(req.params.priceId, 'Fuel price'));
    res.status(204).end();
  });
  return r;
}
