import { Router } from 'express';
import type { AppDeps } from '../context';
import { idParam } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { createSubscription, deleteSubscription, listSubscriptions } from '../services/subscriptions';

/** The signed-in user's own e-mail subscriptions. */
export function subscriptionsRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/subscriptions', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listSubscriptions(deps, actorOf(req)));
  });
  r.post('/subscriptions', requireCapability('fleet:read'), async (req, res) => {
    res.status(201).json(await createSubscription(deps, actorOf(req), req.body));
  });
  r.delete('/subscriptions/:subscriptionId', requireCapability('fleet:read'), async (req, res) => {
    await deleteSubscription(deps, actorOf(req), idParam(req.params.subscriptionId, 'Subscription'));
    res.status(204).end();
  });
  return r;
}
