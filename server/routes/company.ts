import { Router } from 'express';
import { companySettingsSchema } from '../../shared/schemas/users';
import type { AppDeps } from '../context';
import { parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { getCompany, listAudit, listOutbox, updateCompany } from '../services/company';

export function companyRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/company', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getCompany(deps, actorOf(req)));
  });
  r.patch('/company', requireCapability('company:settings'), async (req, res) => {
    res.json(await updateCompany(deps, actorOf(req), parseBody(companySettingsSchema, req.body, 'company settings')));
  });
  r.get('/outbox', requireCapability('outbox:read'), async (req, res) => {
    res.json(await listOutbox(deps, actorOf(req)));
  });
  r.get('/audit', requireCapability('audit:read'), async (req, res) => {
    res.json(await listAudit(deps, actorOf(req)));
  });
  return r;
}
