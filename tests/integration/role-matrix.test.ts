import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../shared/roles';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

let app: TestApp;
let tenant: Tenant;
const clients = {} as Record<Role, HttpClient>;
const NO_SUCH = '00000000-0000-4000-8000-000000000001';

beforeAll(async () => {
  app = await startTestApp();
  tenant = await createTenant(app, 'Petrel Bulk');
  for (const role of ROLES) {
    clients[role] = app.client();
    expect((await clients[role].signIn(tenant.emails[role])).status).toBe(200);
  }
});
afterAll(() => app?.close());

/**
 * Every API route and the roles that may call it (written out here independently of shared/roles.ts, so a change
 * to the capability table shows up as a failing row). Path ids name rows that do not exist where the call would
 * change data, so an allowed role gets 404/422 and a refused role 403: the role check comes first.
 */
// Before beforeAll runs (while test names are made) the vessel shows as a placeholder.
const v = () => tenant?.vesselIds[0] ?? ':vessel';
const ALL: Role[] = [...ROLES];
const EDIT_LOGS: Role[] = ['superintendent', 'chief_engineer'];
const PLAN_OVERHAUL: Role[] = ['superintendent', 'planner'];
const MATRIX: { method: string; path: () => string; body?: unknown; allowed: Role[] }[] = [
  { method: 'GET', path: () => '/api/auth/me', allowed: ALL },
  { method: 'GET', path: () => '/api/vessels', allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}`, allowed: ALL },
  { method: 'POST', path: () => '/api/vessels', body: { name: '' }, allowed: ['admin'] },
  { method: 'PATCH', path: () => `/api/vessels/${NO_SUCH}`, body: {}, allowed: ['admin', 'superintendent'] },
  { method: 'DELETE', path: () => `/api/vessels/${NO_SUCH}`, allowed: ['admin'] },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/bus-sections`, body: { name: 'C' }, allowed: ['admin', 'superintendent', 'chief_engineer'] },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/gensets`, body: {}, allowed: ['admin', 'superintendent', 'chief_engineer'] },
  { method: 'PATCH', path: () => `/api/vessels/${v()}/gensets/${NO_SUCH}`, body: {}, allowed: ['admin', 'superintendent', 'chief_engineer'] },
  { method: 'DELETE', path: () => `/api/vessels/${v()}/gensets/${NO_SUCH}`, allowed: ['admin', 'superintendent', 'chief_engineer'] },
  { method: 'GET', path: () => '/api/members', allowed: ['admin'] },
  { method: 'PATCH', path: () => `/api/members/${NO_SUCH}`, body: { role: 'planner' }, allowed: ['admin'] },
  { method: 'DELETE', path: () => `/api/members/${NO_SUCH}`, allowed: ['admin'] },
  { method: 'GET', path: () => '/api/invitations', allowed: ['admin'] },
  { method: 'POST', path: () => '/api/invitations', body: { email: 'bad' }, allowed: ['admin'] },
  { method: 'DELETE', path: () => `/api/invitations/${NO_SUCH}`, allowed: ['admin'] },
  { method: 'GET', path: () => '/api/company', allowed: ALL },
  { method: 'PATCH', path: () => '/api/company', body: { name: '' }, allowed: ['admin'] },
  { method: 'GET', path: () => '/api/outbox', allowed: ['admin'] },
  { method: 'GET', path: () => '/api/audit', allowed: ['admin', 'superintendent'] },
  // Log intake
  ...['logs', 'logs/export.csv', 'logs/template.csv', 'logs/mappings', 'log-imports', 'meter-replacements', 'mode-hours', 'fuel-lots'].map((tail) => ({
    method: 'GET',
    path: () => `/api/vessels/${v()}/${tail}`,
    allowed: ALL,
  })),
  ...[
    ['POST', 'logs/preview'],
    ['POST', 'logs/commit'],
    ['POST', 'logs'],
    ['PATCH', `logs/${NO_SUCH}`],
    ['DELETE', `logs/${NO_SUCH}`],
    ['POST', `logs/${NO_SUCH}/exclusion`],
    ['POST', `log-imports/${NO_SUCH}/undo`],
    ['POST', 'meter-replacements'],
    ['DELETE', `meter-replacements/${NO_SUCH}`],
    ['PUT', 'mode-hours/2026-01-01'],
    ['DELETE', 'mode-hours/2026-01-01'],
    ['POST', 'fuel-lots'],
    ['PATCH', `fuel-lots/${NO_SUCH}`],
    ['PUT', `fuel-lots/${NO_SUCH}/attachment`],
  ].map(([method, tail]) => ({ method, path: () => `/api/vessels/${NO_SUCH}/${tail}`, body: {}, allowed: EDIT_LOGS })),
  // Curves
  { method: 'GET', path: () => '/api/curves/alerts', allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/curves`, allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/curves/alerts`, allowed: ALL },
  // Recommendations and plans
  { method: 'GET', path: () => `/api/vessels/${v()}/operating-rules`, allowed: ALL },
  { method: 'PUT', path: () => `/api/vessels/${NO_SUCH}/operating-rules/sea`, body: {}, allowed: ['admin', 'superintendent', 'chief_engineer'] },
  { method: 'PUT', path: () => `/api/vessels/${NO_SUCH}/gensets/${NO_SUCH}/status`, body: {}, allowed: ['superintendent', 'chief_engineer'] },
  { method: 'GET', path: () => `/api/vessels/${v()}/plant-model`, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/recommendations`, body: {}, allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/guidelines`, allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/plans`, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/plans`, body: {}, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${v()}/plans/${NO_SUCH}/approve`, body: {}, allowed: ['superintendent'] },
  // Savings, fleet, reports, subscriptions, fuel prices
  { method: 'GET', path: () => `/api/vessels/${v()}/savings`, allowed: ALL },
  { method: 'GET', path: () => '/api/fleet/benchmark', allowed: ['admin', 'superintendent', 'energy_officer'] },
  { method: 'GET', path: () => '/api/fleet/reports/monthly', allowed: ['admin', 'superintendent', 'energy_officer'] },
  { method: 'GET', path: () => '/api/fuel-prices', allowed: ALL },
  { method: 'PUT', path: () => '/api/fuel-prices', body: {}, allowed: ['admin'] },
  { method: 'DELETE', path: () => `/api/fuel-prices/${NO_SUCH}`, allowed: ['admin'] },
  { method: 'GET', path: () => '/api/subscriptions', allowed: ALL },
  { method: 'POST', path: () => '/api/subscriptions', body: {}, allowed: ALL },
  // Running hours and overhaul planning
  { method: 'GET', path: () => '/api/fleet/overhaul', allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/overhaul`, allowed: ALL },
  { method: 'GET', path: () => `/api/vessels/${v()}/work-windows`, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/work-windows`, body: {}, allowed: PLAN_OVERHAUL },
  { method: 'PATCH', path: () => `/api/vessels/${NO_SUCH}/work-windows/${NO_SUCH}`, body: {}, allowed: PLAN_OVERHAUL },
  { method: 'DELETE', path: () => `/api/vessels/${NO_SUCH}/work-windows/${NO_SUCH}`, allowed: PLAN_OVERHAUL },
  { method: 'GET', path: () => `/api/vessels/${v()}/maintenance-events`, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/maintenance-events`, body: {}, allowed: ['superintendent', 'chief_engineer'] },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/overhaul/stagger`, body: {}, allowed: PLAN_OVERHAUL },
  { method: 'GET', path: () => `/api/vessels/${v()}/hour-budgets`, allowed: ALL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/hour-budgets`, body: {}, allowed: PLAN_OVERHAUL },
  { method: 'POST', path: () => `/api/vessels/${NO_SUCH}/hour-budgets/${NO_SUCH}/approve`, body: {}, allowed: PLAN_OVERHAUL },
];

describe('role x route matrix', () => {
  for (const row of MATRIX) {
    for (const role of ROLES) {
      const allowed = row.allowed.includes(role);
      it(`${row.method} ${row.path().replace(NO_SUCH, ':none')} as ${role}: ${allowed ? 'allowed' : 'refused'}`, async () => {
        const res = await clients[role].request(row.method, row.path(), row.body);
        if (allowed) expect([401, 403]).not.toContain(res.status);
        else expect(res.status).toBe(403);
      });
    }
  }

  it('every route refuses an anonymous caller with 401', async () => {
    const anon = app.client();
    for (const row of MATRIX) {
      const res = await anon.request(row.method, row.path(), row.body);
      expect(res.status, `${row.method} ${row.path()}`).toBe(401);
    }
  });

  it('a chief engineer reads and edits only the own vessel', async () => {
    const chief = clients.chief_engineer;
    const list = await chief.get('/api/vessels');
    expect(list.body.map((x: { id: string }) => x.id)).toEqual([tenant.vesselIds[0]]);
    expect((await chief.get(`/api/vessels/${tenant.vesselIds[1]}`)).status).toBe(404);
    expect((await chief.post(`/api/vessels/${tenant.vesselIds[1]}/bus-sections`, { name: 'Z' })).status).toBe(404);
    expect((await chief.post(`/api/vessels/${tenant.vesselIds[0]}/bus-sections`, { name: 'Z' })).status).toBe(201);
  });

  it('an unknown API path answers the JSON error shape', async () => {
    const res = await clients.admin.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
