import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, gensets, vessels } from '../../server/db/schema';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

let app: TestApp;
let a: Tenant;
let b: Tenant;
let adminA: HttpClient;
let adminB: HttpClient;

const genset = (busSectionId: string, designation = 'DG1') => ({
  designation,
  busSectionId,
  ratedKw: 1200,
  ratedKva: 1500,
  voltageV: 450,
  frequencyHz: 60,
  speedClass: 'medium',
  minLoadPct: 30,
  maxLoadPct: 90,
  startCostKg: 8,
  minUpH: 1,
  minDownH: 1,
  shopTestSfoc: { p25: 228, p50: 205, p75: 196, p85: 195, p100: 198 },
  duty: 'service',
  maintenance: [{ kind: 'top overhaul', intervalHours: 12000, lastDoneRunningHours: 30500, lastDoneOn: '2026-03-01' }],
});

beforeAll(async () => {
  app = await startTestApp();
  a = await createTenant(app, 'Skua Carriers');
  b = await createTenant(app, 'Tern Offshore');
  adminA = app.client();
  adminB = app.client();
  await adminA.signIn(a.emails.admin);
  await adminB.signIn(b.emails.admin);
});
afterAll(() => app?.close());

describe('vessel and genset register', () => {
  let vesselId: string;
  let sectionA: string;

  it('creates a vessel with two bus sections and audits it', async () => {
    const res = await adminA.post('/api/vessels', {
      name: 'Skua Dawn',
      imoNumber: '9876501',
      vesselType: 'container ship',
      fuelGrades: ['VLSFO', 'MGO'],
      busSections: ['A', 'B'],
    });
    expect(res.status).toBe(201);
    vesselId = res.body.id;
    expect(res.body.busSections.map((s: { name: string }) => s.name)).toEqual(['A', 'B']);
    sectionA = res.body.busSections[0].id;
    const audit = await app.database.db.select().from(auditLog).where(eq(auditLog.entityId, vesselId));
    expect(audit.map((x) => x.action)).toEqual(['create']);
  });

  it('names every bad field of a genset and stores nothing', async () => {
    const bad = { ...genset(sectionA), ratedKw: -5, minLoadPct: 95, maxLoadPct: 90, shopTestSfoc: { p25: 100, p50: null, p75: null, p85: null, p100: null } };
    const res = await adminA.post(`/api/vessels/${vesselId}/gensets`, bad);
    expect(res.status).toBe(422);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['ratedKw', 'shopTestSfoc.p25']));
    expect(await app.database.db.select().from(gensets).where(eq(gensets.vesselId, vesselId))).toHaveLength(0);
  });

  it('adds, edits (audited with before and after) and refuses a duplicate designation', async () => {
    const created = await adminA.post(`/api/vessels/${vesselId}/gensets`, genset(sectionA));
    expect(created.status).toBe(201);
    expect(created.body.maintenance[0]).toMatchObject({ kind: 'top overhaul', intervalHours: 12000 });
    const dup = await adminA.post(`/api/vessels/${vesselId}/gensets`, genset(sectionA));
    expect(dup.status).toBe(409);
    expect(dup.body.error.details[0].path).toBe('designation');
    const edited = await adminA.patch(`/api/vessels/${vesselId}/gensets/${created.body.id}`, { ...genset(sectionA), ratedKw: 1250 });
    expect(edited.status).toBe(200);
    expect(edited.body.ratedKw).toBe(1250);
    const audit = await app.database.db.select().from(auditLog).where(eq(auditLog.entityId, created.body.id));
    const update = audit.find((x) => x.action === 'update')!;
    expect((update.before as { ratedKw: number }).ratedKw).toBe(1200);
    expect((update.after as { ratedKw: number }).ratedKw).toBe(1250);
  });

  it('refuses a bus section of another vessel', async () => {
    const other = await adminA.post('/api/vessels', { name: 'Skua Dusk', imoNumber: '9876502', vesselType: 'oil tanker', fuelGrades: ['MGO'], busSections: ['A'] });
    const res = await adminA.post(`/api/vessels/${vesselId}/gensets`, genset(other.body.busSections[0].id, 'DG2'));
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('busSectionId');
  });
});

describe('company isolation', () => {
  it('a user of one company never reads or changes another company’s data', async () => {
    const listB = await adminB.get('/api/vessels');
    const idsA = new Set(a.vesselIds);
    expect(listB.body.some((v: { id: string }) => idsA.has(v.id))).toBe(false);
    const target = a.vesselIds[0];
    expect((await adminB.get(`/api/vessels/${target}`)).status).toBe(404);
    expect((await adminB.patch(`/api/vessels/${target}`, { name: 'Hijacked' })).status).toBe(404);
    expect((await adminB.delete(`/api/vessels/${target}`)).status).toBe(404);
    expect((await adminB.post(`/api/vessels/${target}/bus-sections`, { name: 'X' })).status).toBe(404);
    const membersA = await adminA.get('/api/members');
    const someone = membersA.body[0].membershipId;
    expect((await adminB.patch(`/api/members/${someone}`, { role: 'admin' })).status).toBe(404);
    expect((await adminB.delete(`/api/members/${someone}`)).status).toBe(404);
    const [row] = await app.database.db.select().from(vessels).where(eq(vessels.id, target));
    expect(row.name).toBe('Skua Carriers One');
    const auditB = await adminB.get('/api/audit');
    expect(auditB.body.every((e: { entityId: string }) => !idsA.has(e.entityId))).toBe(true);
  });

  it('keeps at least one administrator', async () => {
    const members = await adminB.get('/api/members');
    const me = members.body.find((m: { role: string }) => m.role === 'admin');
    const demote = await adminB.patch(`/api/members/${me.membershipId}`, { role: 'planner' });
    expect(demote.status).toBe(409);
  });
});
