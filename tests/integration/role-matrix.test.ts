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
const v = () => tenant.vesselIds[0];
const ALL: Role[] = [...ROLES];
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
];

describe('role x route matrix', () => {
  for (const row of MATRIX) {
    for (const role of ROLES) {
      const allowed = row.allowed.includes(role);
      it(`${row.method} ${row.path.toString().replace(/^\(\) => /, '')} as ${role}: ${allowed ? 'allowed' : 'refused'}`, async () => {
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
