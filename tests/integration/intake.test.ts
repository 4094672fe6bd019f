import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ISO_3046_REFERENCE_LCV_KJ_PER_KG, CF_TABLE } from '../../optimizer/index';
import { auditLog, busSections, gensetDailyLogs, gensets, logImports, vesselModeHours } from '../../server/db/schema';
import { TEMPLATE_HEADERS } from '../../server/lib/csv-mapping';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

let app: TestApp;
let t: Tenant;
let other: Tenant;
let vesselId: string;
let dg1: string;
let dg2: string;
let lotId: string;
const c = {} as Record<'chief' | 'super' | 'energy' | 'admin' | 'planner' | 'otherSuper', HttpClient>;
const uploads = mkdtempSync(path.join(tmpdir(), 'kilowatch-intake-'));

interface Res {
  status: number;
  body: any;
  headers: Headers;
}

async function multipart(client: HttpClient, method: string, url: string, file: { name: string; content: string | Uint8Array } | null, options?: unknown): Promise<Res> {
  const form = new FormData();
  if (file) form.append('file', new Blob([file.content as BlobPart]), file.name);
  if (options !== undefined) form.append('options', typeof options === 'string' ? options : JSON.stringify(options));
  const res = await fetch(`${app.baseUrl}${url}`, { method, headers: { origin: app.baseUrl, ...(client.cookie ? { cookie: client.cookie } : {}) }, body: form });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    // not JSON
  }
  return { status: res.status, body, headers: res.headers };
}

const preview = (client: HttpClient, name: string, content: string | Uint8Array, options: unknown = {}, vid = vesselId) =>
  multipart(client, 'POST', `/api/vessels/${vid}/logs/preview`, { name, content }, options);

async function commit(client: HttpClient, name: string, content: string | Uint8Array, extra: { overwriteChanged?: boolean; mapping?: unknown; fileSha256?: string } = {}) {
  const p = await preview(client, name, content, extra.mapping ? { mapping: extra.mapping } : {});
  if (p.status !== 200) return p;
  return multipart(client, 'POST', `/api/vessels/${vesselId}/logs/commit`, { name, content }, {
    mapping: p.body.mapping,
    overwriteChanged: extra.overwriteChanged ?? false,
    fileSha256: extra.fileSha256 ?? p.body.fileSha256,
  });
}

async function logCount(): Promise<number> {
  const [r] = await app.database.db.select({ n: count() }).from(gensetDailyLogs);
  return r.n;
}

async function importCount(): Promise<number> {
  const [r] = await app.database.db.select({ n: count() }).from(logImports);
  return r.n;
}

const V1 = [
  'date,genset,running_hours_meter_h,kwh_meter_kwh,fuel_volume_l,fuel_temp_c,fuel_lot,remarks',
  '2026-06-01,DG1,1000,50000,0,15,BDN-1,',
  '2026-06-02,DG1,1020,60000,2600,45,BDN-1,',
  '2026-06-03,DG1,1044,72000,3000,45,BDN-1,',
  '2026-06-01,DG2,500,20000,0,15,BDN-1,',
  '2026-06-02,DG2,510,24000,1100,40,BDN-1,',
  '2026-06-03,DG2,520,28000,1100,40,BDN-1,"boiler soot blow, ok"',
].join('\n');
const V2 = [
  ...V1.split('\n').map((l) => (l.startsWith('2026-06-03,DG1') ? '2026-06-03,DG1,1044,72000,3100,45,BDN-1,' : l)),
  '2026-06-04,DG1,1068,84000,3000,45,BDN-1,',
  '2026-06-04,DG2,530,32000,1100,40,BDN-1,',
].join('\n');

beforeAll(async () => {
  app = await startTestApp();
  app.deps.config.uploadDir = uploads;
  t = await createTenant(app, 'Petrel Lines');
  other = await createTenant(app, 'Gannet Bulk');
  vesselId = t.vesselIds[0];
  const db = app.database.db;
  const [section] = await db.insert(busSections).values({ vesselId, name: 'A' }).returning();
  const shop = { p25: 230, p50: 210, p75: 200, p85: 199, p100: 202 };
  const base = { vesselId, busSectionId: section.id, ratedKva: 1250, voltageV: 440, frequencyHz: 60, speedClass: 'medium' as const, maxLoadPct: 90, shopTestSfoc: shop };
  [{ id: dg1 }] = await db.insert(gensets).values({ ...base, designation: 'DG1', ratedKw: 1000, minLoadPct: 30 }).returning();
  [{ id: dg2 }] = await db.insert(gensets).values({ ...base, designation: 'DG2', ratedKw: 800, ratedKva: 1000, minLoadPct: 30 }).returning();
  const roles = { chief: t.emails.chief_engineer, super: t.emails.superintendent, energy: t.emails.energy_officer, admin: t.emails.admin, planner: t.emails.planner, otherSuper: other.emails.superintendent };
  for (const [k, email] of Object.entries(roles)) {
    c[k as keyof typeof c] = app.client();
    await c[k as keyof typeof c].signIn(email);
  }
});
afterAll(async () => {
  await app?.close();
  rmSync(uploads, { recursive: true, force: true });
});

describe('fuel lot register', () => {
  it('estimates a missing LCV from density by the ISO 8217 annex formula and marks it estimated', async () => {
    const res = await c.chief.post(`/api/vessels/${vesselId}/fuel-lots`, { reference: 'BDN-1', grade: 'MGO', density15KgPerM3: 850, sulphurPct: null, deliveredOn: '2026-05-20' });
    expect(res.status).toBe(201);
    lotId = res.body.id;
    // By hand, ISO 8217 annex distillate formula (constants 46.423, 8.792, 3.170; from memory, as optimizer/fuel):
    // 46.423 − 8.792·0.85² + 3.170·0.85 = 42.76528 MJ/kg (no water, ash, sulphur). Tolerance 1e-9 MJ/kg.
    expect(res.body.lcvMjPerKg).toBeCloseTo(46.423 - 8.792 * 0.85 ** 2 + 3.17 * 0.85, 9);
    expect(res.body.lcvEstimated).toBe(true);
    const measured = await c.super.post(`/api/vessels/${vesselId}/fuel-lots`, { reference: 'BDN-2', grade: 'VLSFO', density15KgPerM3: 960, lcvMjPerKg: 41.2, deliveredOn: '2026-05-25' });
    expect(measured.body).toMatchObject({ lcvMjPerKg: 41.2, lcvEstimated: false });
    const dup = await c.chief.post(`/api/vessels/${vesselId}/fuel-lots`, { reference: 'BDN-1', grade: 'MGO', density15KgPerM3: 850, deliveredOn: '2026-05-20' });
    expect(dup.status).toBe(409);
    const bad = await c.chief.post(`/api/vessels/${vesselId}/fuel-lots`, { reference: 'X', grade: 'KEROSENE', density15KgPerM3: 2000, deliveredOn: '2026-05-20' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['grade', 'density15KgPerM3']));
  });

  it('stores a sniffed PDF under <company>/<uuid>, serves it as an attachment, refuses other content', async () => {
    const pdf = new Uint8Array([...new TextEncoder().encode('%PDF-1.4\n% test\n'), 0x25, 0x25, 0x45, 0x4f, 0x46]);
    const put = await multipart(c.chief, 'PUT', `/api/vessels/${vesselId}/fuel-lots/${lotId}/attachment`, { name: '../../etc/bdn 1.pdf', content: pdf });
    expect(put.status).toBe(200);
    expect(put.body.attachment).toMatchObject({ type: 'application/pdf', bytes: pdf.length });
    const stored = readdirSync(path.join(uploads, t.companyId));
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatch(/^[0-9a-f-]{36}$/);
    const res = await fetch(`${app.baseUrl}/api/vessels/${vesselId}/fuel-lots/${lotId}/attachment`, { headers: { cookie: c.energy.cookie as string } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename=".*\.pdf"$/);
    expect(new Uint8Array(await res.arrayBuffer())).toEqual(pdf);
    const exe = await multipart(c.chief, 'PUT', `/api/vessels/${vesselId}/fuel-lots/${lotId}/attachment`, { name: 'note.pdf', content: new Uint8Array([0x4d, 0x5a, 0x90, 0, 3]) });
    expect(exe.status).toBe(415);
    const renamed = await multipart(c.chief, 'PUT', `/api/vessels/${vesselId}/fuel-lots/${lotId}/attachment`, { name: 'note.exe', content: pdf });
    expect(renamed.status).toBe(415);
    const foreign = await fetch(`${app.baseUrl}/api/vessels/${vesselId}/fuel-lots/${lotId}/attachment`, { headers: { cookie: c.otherSuper.cookie as string } });
    expect(foreign.status).toBe(404);
  });
});

describe('upload → preview → commit → re-upload → overwrite → undo', () => {
  let imp1: string;
  let imp2: string;
  let imp3: string;

  it('previews every row with derived values and stores nothing', async () => {
    const res = await preview(c.chief, 'june.csv', V1);
    expect(res.status).toBe(200);
    expect(res.body.mappingSource).toBe('guessed');
    expect(res.body.counts).toEqual({ total: 6, new: 6, changed: 0, unchanged: 0, rejected: 0 });
    const row = res.body.rows.find((r: any) => r.designation === 'DG1' && r.logDate === '2026-06-02');
    expect(row.row).toBe(3);
    // One row by hand. Table 54B (ASTM D1250-80 / ISO 91-1), fuel-oil band K0 = 186.9696, K1 = 0.4862:
    // alpha = K0/rho² + K1/rho, VCF = exp(−alpha·Δt·(1 + 0.8·alpha·Δt)), Δt = 45 − 15 °C.
    const rho = 850;
    const alpha = 186.9696 / rho ** 2 + 0.4862 / rho;
    const vcf = Math.exp(-alpha * 30 * (1 + 0.8 * alpha * 30));
    const massKg = 2.6 * vcf * rho;
    // ISO 3046-1: fuel referred to the reference LCV 42 700 kJ/kg; LCV of the lot 42 765.28 kJ/kg (ISO 8217 annex).
    const lcvKj = (46.423 - 8.792 * 0.85 ** 2 + 3.17 * 0.85) * 1000;
    const isoKg = (massKg * lcvKj) / 42_700;
    expect(ISO_3046_REFERENCE_LCV_KJ_PER_KG).toBe(42_700);
    const tol = 1e-9;
    expect(row.derived.hoursRun).toBe(20);
    expect(row.derived.kwh).toBe(10_000);
    expect(row.derived.avgLoadKw).toBe(500);
    expect(row.derived.avgLoadPct).toBe(50);
    expect(Math.abs(row.derived.fuelKgAt15 - massKg) / massKg).toBeLessThan(tol);
    expect(Math.abs(row.derived.sfocObservedGPerKwh - (1000 * massKg) / 10_000) / 216).toBeLessThan(tol);
    expect(Math.abs(row.derived.sfocIsoGPerKwh - (1000 * isoKg) / 10_000) / 216).toBeLessThan(tol);
    // CO2: MEPC.364(79) Cf of diesel/gas oil 3.206 t/t.
    expect(CF_TABLE['diesel-gas-oil'].cfTCo2PerTFuel).toBe(3.206);
    expect(Math.abs(row.derived.co2Kg - massKg * 3.206) / (massKg * 3.206)).toBeLessThan(tol);
    const first = res.body.rows.find((r: any) => r.designation === 'DG1' && r.logDate === '2026-06-01');
    expect(first.flags.map((f: any) => f.code)).toContain('METER_PREVIOUS_MISSING');
    expect(await logCount()).toBe(0);
  });

  it('commits in one go and records the import', async () => {
    const res = await commit(c.chief, 'june.csv', V1);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ rowsNew: 6, rowsChanged: 0, rowsUnchanged: 0, rowsRejected: 0 });
    imp1 = res.body.importId;
    expect(await logCount()).toBe(6);
    const [stored] = await app.database.db.select().from(gensetDailyLogs).where(sql`${gensetDailyLogs.gensetId} = ${dg2} and ${gensetDailyLogs.logDate} = '2026-06-03'`);
    expect(stored).toMatchObject({ runningHoursMeter: 520, kwhMeter: 28000, fuelVolumeL: 1100, fuelTempC: 40, fuelLotId: lotId, remarks: 'boiler soot blow, ok', source: 'import', importId: imp1 });
    const history = await c.energy.get(`/api/vessels/${vesselId}/log-imports`);
    expect(history.body).toHaveLength(1);
    expect(history.body[0]).toMatchObject({ fileName: 'june.csv', rowsNew: 6, status: 'committed', userName: expect.stringContaining('chief_engineer') });
  });

  it('offers the saved mapping next time and shows new / changed / unchanged', async () => {
    const res = await preview(c.chief, 'june-v2.csv', V2);
    expect(res.body.mappingSource).toBe('saved');
    expect(res.body.counts).toEqual({ total: 8, new: 2, changed: 1, unchanged: 5, rejected: 0 });
    const changed = res.body.rows.find((r: any) => r.status === 'changed');
    expect(changed).toMatchObject({ designation: 'DG1', logDate: '2026-06-03', values: { fuelVolumeL: 3100 }, before: { fuelVolumeL: 3000 } });
  });

  it('asks before overwriting: without overwriteChanged the changed row stays as stored', async () => {
    const res = await commit(c.chief, 'june-v2.csv', V2, { overwriteChanged: false });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ rowsNew: 2, rowsChanged: 0, rowsChangedSkipped: 1 });
    imp2 = res.body.importId;
    expect(await logCount()).toBe(8);
    const [d3] = await app.database.db.select().from(gensetDailyLogs).where(sql`${gensetDailyLogs.gensetId} = ${dg1} and ${gensetDailyLogs.logDate} = '2026-06-03'`);
    expect(d3.fuelVolumeL).toBe(3000);
  });

  it('overwrites when asked and keeps the before values', async () => {
    const res = await commit(c.chief, 'june-v2.csv', V2, { overwriteChanged: true });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ rowsNew: 0, rowsChanged: 1, rowsUnchanged: 7 });
    imp3 = res.body.importId;
    const [d3] = await app.database.db.select().from(gensetDailyLogs).where(sql`${gensetDailyLogs.gensetId} = ${dg1} and ${gensetDailyLogs.logDate} = '2026-06-03'`);
    expect(d3).toMatchObject({ fuelVolumeL: 3100, importId: imp3 });
    expect(await logCount()).toBe(8);
  });

  it('refuses to undo an import whose rows a later import overwrote', async () => {
    const res = await c.chief.post(`/api/vessels/${vesselId}/log-imports/${imp1}/undo`);
    expect(res.status).toBe(409);
    expect(res.body.error.details[0]).toMatchObject({ path: 'DG1 2026-06-03', message: 'Overwritten by a later import' });
    expect(await logCount()).toBe(8);
  });

  it('undo restores overwritten values, then removes exactly the new rows', async () => {
    const u3 = await c.chief.post(`/api/vessels/${vesselId}/log-imports/${imp3}/undo`);
    expect(u3.status).toBe(200);
    expect(u3.body).toEqual({ rowsRemoved: 0, rowsRestored: 1 });
    const [d3] = await app.database.db.select().from(gensetDailyLogs).where(sql`${gensetDailyLogs.gensetId} = ${dg1} and ${gensetDailyLogs.logDate} = '2026-06-03'`);
    expect(d3).toMatchObject({ fuelVolumeL: 3000, importId: imp1, source: 'import' });
    const u2 = await c.super.post(`/api/vessels/${vesselId}/log-imports/${imp2}/undo`);
    expect(u2.body).toEqual({ rowsRemoved: 2, rowsRestored: 0 });
    expect(await logCount()).toBe(6);
    const again = await c.super.post(`/api/vessels/${vesselId}/log-imports/${imp3}/undo`);
    expect(again.status).toBe(409);
    const hist = await c.chief.get(`/api/vessels/${vesselId}/log-imports`);
    expect(hist.body.map((h: any) => h.status)).toEqual(['undone', 'undone', 'committed']);
  });

  it('refuses to undo an import after a hand edit of one of its rows', async () => {
    const list = await c.chief.get(`/api/vessels/${vesselId}/logs?gensetId=${dg2}&from=2026-06-02&to=2026-06-02`);
    const row = list.body.rows[0];
    const edit = await c.chief.patch(`/api/vessels/${vesselId}/logs/${row.id}`, {
      gensetId: dg2,
      logDate: '2026-06-02',
      runningHoursMeter: 510,
      kwhMeter: 24000,
      fuelVolumeL: 1150,
      fuelTempC: 40,
      fuelLotId: lotId,
      remarks: 'corrected sounding',
    });
    expect(edit.status).toBe(200);
    expect(edit.body.source).toBe('manual');
    const audit = await app.database.db.select().from(auditLog).where(eq(auditLog.entityId, row.id));
    expect(audit.map((a) => a.action)).toEqual(['update']);
    expect((audit[0].before as any).fuelVolumeL).toBe(1100);
    expect((audit[0].after as any).fuelVolumeL).toBe(1150);
    const res = await c.chief.post(`/api/vessels/${vesselId}/log-imports/${imp1}/undo`);
    expect(res.status).toBe(409);
    expect(res.body.error.details[0].message).toBe('Edited by hand after this import');
    expect(await logCount()).toBe(6);
  });
});

describe('log table: server-side paging, sorting, filters', () => {
  it('pages, sorts by a derived column and filters by set, date and flag', async () => {
    const page1 = await c.energy.get(`/api/vessels/${vesselId}/logs?pageSize=4&page=1&sort=logDate&dir=asc`);
    expect(page1.status).toBe(200);
    expect(page1.body.total).toBe(6);
    expect(page1.body.rows).toHaveLength(4);
    expect(page1.body.rows.map((r: any) => r.logDate)).toEqual(['2026-06-01', '2026-06-01', '2026-06-02', '2026-06-02']);
    const page2 = await c.energy.get(`/api/vessels/${vesselId}/logs?pageSize=4&page=2&sort=logDate&dir=asc`);
    expect(page2.body.rows).toHaveLength(2);
    const bySfoc = await c.energy.get(`/api/vessels/${vesselId}/logs?sort=sfocIsoGPerKwh&dir=desc`);
    const values = bySfoc.body.rows.map((r: any) => r.derived.sfocIsoGPerKwh).filter((v: number | null) => v !== null);
    expect(values.length).toBeGreaterThan(2);
    expect([...values].sort((a: number, b: number) => b - a)).toEqual(values);
    const dg1Only = await c.energy.get(`/api/vessels/${vesselId}/logs?gensetId=${dg1}&from=2026-06-02&to=2026-06-03`);
    expect(dg1Only.body.rows.map((r: any) => `${r.designation} ${r.logDate}`).sort()).toEqual(['DG1 2026-06-02', 'DG1 2026-06-03']);
    // The day before the range still feeds the meter delta (derived on read from raw values).
    expect(dg1Only.body.rows.find((r: any) => r.logDate === '2026-06-02').derived.hoursRun).toBe(20);
    const flagged = await c.energy.get(`/api/vessels/${vesselId}/logs?flag=METER_PREVIOUS_MISSING`);
    expect(flagged.body.rows.map((r: any) => r.logDate)).toEqual(['2026-06-01', '2026-06-01']);
    const badQuery = await c.energy.get(`/api/vessels/${vesselId}/logs?sort=nonsense`);
    expect(badQuery.status).toBe(422);
  });

  it('exports CSV with units in headers and neutralised formula-like text', async () => {
    const list = await c.chief.get(`/api/vessels/${vesselId}/logs?gensetId=${dg1}&from=2026-06-03&to=2026-06-03`);
    const row = list.body.rows[0];
    await c.chief.patch(`/api/vessels/${vesselId}/logs/${row.id}`, {
      gensetId: dg1,
      logDate: '2026-06-03',
      runningHoursMeter: row.runningHoursMeter,
      kwhMeter: row.kwhMeter,
      fuelVolumeL: row.fuelVolumeL,
      fuelTempC: row.fuelTempC,
      fuelLotId: lotId,
      remarks: '=HYPERLINK("http://evil.example","x")',
    });
    const res = await fetch(`${app.baseUrl}/api/vessels/${vesselId}/logs/export.csv`, { headers: { cookie: c.energy.cookie as string } });
    expect(res.headers.get('content-disposition')).toMatch(/^attachment;/);
    const text = await res.text();
    expect(text.split('\r\n')[0]).toContain('sfoc_iso_g_per_kwh');
    expect(text).toContain(`"'=HYPERLINK(""http://evil.example"",""x"")"`);
    expect(text).not.toMatch(/,=HYPERLINK/);
  });
});

describe('meter replacement', () => {
  it('flags a negative delta, and a recorded replacement resolves it with the right kWh', async () => {
    const csv = ['date,genset,running_hours_meter_h,kwh_meter_kwh,fuel_mass_kg,fuel_lot', '2026-07-01,DG1,2000,90000,0,BDN-1', '2026-07-02,DG1,2024,1500,2400,BDN-1'].join('\n');
    const res = await commit(c.chief, 'july.csv', csv);
    expect(res.status).toBe(201);
    const flagged = await c.chief.get(`/api/vessels/${vesselId}/logs?flag=METER_NEGATIVE_DELTA`);
    expect(flagged.body.rows.map((r: any) => r.logDate)).toEqual(['2026-07-02']);
    expect(flagged.body.rows[0].derived.kwh).toBeNull();
    const rep = await c.chief.post(`/api/vessels/${vesselId}/meter-replacements`, { gensetId: dg1, meter: 'kwh', replacedOn: '2026-07-02', oldFinalReading: 99_000, newStartReading: 0 });
    expect(rep.status).toBe(201);
    const after = await c.chief.get(`/api/vessels/${vesselId}/logs?gensetId=${dg1}&from=2026-07-02&to=2026-07-02`);
    // (old final − yesterday) + (today − new start) = (99 000 − 90 000) + (1 500 − 0) = 10 500 kWh, by hand.
    expect(after.body.rows[0].derived.kwh).toBe(10_500);
    expect(after.body.rows[0].flags.map((f: any) => f.code)).not.toContain('METER_NEGATIVE_DELTA');
    expect(after.body.rows[0].derived.sfocObservedGPerKwh).toBeCloseTo((2400 * 1000) / 10_500, 9);
  });
});

describe('manual entry, exclusion, mode hours', () => {
  it('creates, validates, excludes with a reason, includes again and deletes; all audited', async () => {
    const bad = await c.chief.post(`/api/vessels/${vesselId}/logs`, { gensetId: dg2, logDate: '2026-08-01', hoursRun: 12, kwh: 3000, fuelVolumeL: 900 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details[0].path).toBe('fuelTempC');
    const hot = await c.chief.post(`/api/vessels/${vesselId}/logs`, { gensetId: dg2, logDate: '2026-08-01', hoursRun: 12, kwh: 3000, fuelVolumeL: 900, fuelTempC: 200, fuelLotId: lotId });
    expect(hot.status).toBe(422);
    expect(hot.body.error.details[0].path).toBe('fuelTempC');
    const ok = await c.chief.post(`/api/vessels/${vesselId}/logs`, { gensetId: dg2, logDate: '2026-08-01', hoursRun: 12, kwh: 3000, fuelMassKg: 690, fuelLotId: lotId });
    expect(ok.status).toBe(201);
    expect(ok.body.derived.sfocObservedGPerKwh).toBeCloseTo(230, 9);
    const dup = await c.chief.post(`/api/vessels/${vesselId}/logs`, { gensetId: dg2, logDate: '2026-08-01', hoursRun: 1, kwh: 1 });
    expect(dup.status).toBe(409);
    const noReason = await c.chief.post(`/api/vessels/${vesselId}/logs/${ok.body.id}/exclusion`, { excluded: true });
    expect(noReason.status).toBe(422);
    const ex = await c.chief.post(`/api/vessels/${vesselId}/logs/${ok.body.id}/exclusion`, { excluded: true, reason: 'purifier bypass test' });
    expect(ex.body).toMatchObject({ excludedFromFit: true, excludeReason: 'purifier bypass test' });
    const inc = await c.chief.post(`/api/vessels/${vesselId}/logs/${ok.body.id}/exclusion`, { excluded: false });
    expect(inc.body).toMatchObject({ excludedFromFit: false, excludeReason: null });
    const del = await c.chief.delete(`/api/vessels/${vesselId}/logs/${ok.body.id}`);
    expect(del.status).toBe(204);
    const audit = await app.database.db.select().from(auditLog).where(eq(auditLog.entityId, ok.body.id));
    expect(audit.map((a) => a.action)).toEqual(['create', 'exclude', 'include', 'delete']);
  });

  it('takes mode hours by hand and from a CSV column group', async () => {
    const put = await c.chief.request('PUT', `/api/vessels/${vesselId}/mode-hours/2026-08-02`, { seaH: 20, manoeuvringH: 4 });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ seaH: 20, manoeuvringH: 4, portH: 0 });
    const over = await c.chief.request('PUT', `/api/vessels/${vesselId}/mode-hours/2026-08-03`, { seaH: 20, portH: 6 });
    expect(over.status).toBe(422);
    const csv = ['date;sea_h;port_h;anchorage_h', '04.08.2026;12,5;11,5;0', '05.08.2026;0;24;0'].join('\n');
    const res = await commit(c.chief, 'modes.csv', csv);
    expect(res.status).toBe(201);
    expect(res.body.modeDaysWritten).toBe(2);
    const rows = await app.database.db.select().from(vesselModeHours).where(eq(vesselModeHours.vesselId, vesselId));
    expect(rows.find((r) => r.logDate === '2026-08-04')).toMatchObject({ seaH: 12.5, portH: 11.5 });
    const undo = await c.chief.post(`/api/vessels/${vesselId}/log-imports/${res.body.importId}/undo`);
    expect(undo.status).toBe(200);
    const left = await app.database.db.select().from(vesselModeHours).where(eq(vesselModeHours.vesselId, vesselId));
    expect(left.map((r) => r.logDate)).toEqual(['2026-08-02']);
  });
});

describe('template', () => {
  it('downloads the template, and a filled-in template maps itself', async () => {
    const res = await fetch(`${app.baseUrl}/api/vessels/${vesselId}/logs/template.csv`, { headers: { cookie: c.energy.cookie as string } });
    const text = (await res.text()).replace(/^\uFEFF/, '');
    expect(text.split('\r\n')[0]).toBe(TEMPLATE_HEADERS.join(','));
    const filled = [TEMPLATE_HEADERS.join(','), '2026-09-01,DG1,,20,,9000,2000,,,BDN-1,,24,0,0,0,0'].join('\n');
    const p = await preview(c.chief, 'template.csv', filled);
    expect(p.status).toBe(200);
    expect(p.body.rows[0]).toMatchObject({ status: 'new', values: { hoursRun: 20, kwh: 9000, fuelMassKg: 2000, fuelLotId: lotId } });
  });
});

describe('malformed and hostile files: a clear error, and no row changed', () => {
  const head = 'date,genset,hours_run_h,kwh_produced_kwh,fuel_mass_kg,fuel_lot';
  const good = '2026-10-01,DG1,20,9000,2000,BDN-1';
  const cases: { name: string; file: string; content: string | Uint8Array; options?: unknown; status: number; path?: string; row?: number; message: RegExp }[] = [
    { name: 'binary (PNG) named .csv', file: 'x.csv', content: new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]), status: 415, path: 'file', message: /PNG image, not CSV/ },
    { name: 'NUL bytes in text', file: 'x.csv', content: `${head}\n2026-10-01,DG1\u0000,1,1,1,BDN-1`, status: 415, path: 'file', message: /binary data/ },
    { name: 'not a .csv name', file: 'x.xlsx', content: `${head}\n${good}`, status: 415, path: 'file', message: /not a CSV file/ },
    { name: 'empty', file: 'x.csv', content: '', status: 400, path: 'file', message: /empty/ },
    { name: 'header only', file: 'x.csv', content: `${head}\n`, status: 422, row: 2, message: /no data rows/ },
    { name: 'unknown columns', file: 'x.csv', content: 'foo,bar\n1,2', status: 422, path: 'date', message: /No column is mapped to the date/ },
    {
      name: 'wrong unit in the mapping',
      file: 'x.csv',
      content: `${head}\n${good}`,
      options: { mapping: { columns: { date: { field: 'date' }, genset: { field: 'genset' }, fuel_mass_kg: { field: 'fuelMass', unit: 'L' } } } },
      status: 422,
      path: 'mapping.columns.fuel_mass_kg.unit',
      message: /Fuel mass is in kg or t/,
    },
    { name: 'text in a number field', file: 'x.csv', content: `${head}\n2026-10-01,DG1,twenty,9000,2000,BDN-1`, status: 422, path: 'hours_run_h', row: 2, message: /"twenty" is not a number/ },
    { name: 'date out of range (past)', file: 'x.csv', content: `${head}\n1899-12-31,DG1,20,9000,2000,BDN-1`, status: 422, path: 'date', row: 2, message: /outside the accepted range/ },
    { name: 'date in the future', file: 'x.csv', content: `${head}\n2099-01-01,DG1,20,9000,2000,BDN-1`, status: 422, path: 'date', row: 2, message: /outside the accepted range/ },
    { name: 'impossible date', file: 'x.csv', content: `${head}\n2026-02-30,DG1,20,9000,2000,BDN-1`, status: 422, path: 'date', row: 2, message: /not a calendar date/ },
    { name: 'formula-like cell in a number field', file: 'x.csv', content: `${head}\n2026-10-01,DG1,=1+19,9000,2000,BDN-1`, status: 422, path: 'hours_run_h', row: 2, message: /"=1\+19" is not a number/ },
    { name: 'ambiguous dates without a choice', file: 'x.csv', content: `${head.replace('date', 'date')}\n01/10/2026,DG1,20,9000,2000,BDN-1\n02/10/2026,DG1,20,9000,2000,BDN-1`, status: 422, path: 'dateFormat', message: /ambiguous/ },
    { name: 'duplicate dates', file: 'x.csv', content: `${head}\n${good}\n${good}`, status: 422, path: 'date', row: 2, message: /appears 2 times/ },
    { name: 'unknown genset', file: 'x.csv', content: `${head}\n2026-10-01,DG9,20,9000,2000,BDN-1`, status: 422, path: 'genset', row: 2, message: /not in this vessel's genset register/ },
    { name: 'unknown fuel lot', file: 'x.csv', content: `${head}\n2026-10-01,DG1,20,9000,2000,NOPE`, status: 422, path: 'fuel_lot', row: 2, message: /not in this vessel's fuel lot register/ },
    { name: 'negative fuel', file: 'x.csv', content: `${head}\n2026-10-01,DG1,20,9000,-5,BDN-1`, status: 422, path: 'fuel_mass_kg', row: 2, message: /cannot be negative/ },
    { name: 'volume without temperature', file: 'x.csv', content: 'date,genset,hours_run_h,kwh_produced_kwh,fuel_volume_l\n2026-10-01,DG1,20,9000,2000', status: 422, path: 'fuelTempC', row: 2, message: /needs its temperature/ },
    { name: 'fuel temperature outside Table 54B', file: 'x.csv', content: 'date,genset,hours_run_h,kwh_produced_kwh,fuel_volume_l,fuel_temp_c,fuel_lot\n2026-10-01,DG1,20,9000,2000,180,BDN-1', status: 422, path: 'fuelTempC', row: 2, message: /outside Table 54B/ },
    { name: 'unclosed quote', file: 'x.csv', content: `${head}\n2026-10-01,"DG1,20,9000,2000,BDN-1`, status: 422, path: 'file', message: /quote/ },
    { name: 'duplicate header', file: 'x.csv', content: 'date,date,genset\n2026-10-01,2026-10-01,DG1', status: 422, path: 'date', row: 1, message: /appears twice/ },
    { name: 'options not JSON', file: 'x.csv', content: `${head}\n${good}`, options: '{nope', status: 400, path: 'options', message: /not valid JSON/ },
  ];

  for (const k of cases) {
    it(k.name, async () => {
      const before = await logCount();
      const imports = await importCount();
      const p = await preview(c.chief, k.file, k.content, k.options ?? {});
      let res: Res = p;
      if (p.status === 200) {
        // Row-level problems: the preview names them, the commit imports nothing.
        const issue = p.body.rows.flatMap((r: any) => r.errors)[0];
        expect(issue).toBeDefined();
        res = await multipart(c.chief, 'POST', `/api/vessels/${vesselId}/logs/commit`, { name: k.file, content: k.content }, { mapping: p.body.mapping, overwriteChanged: true, fileSha256: p.body.fileSha256 });
      }
      expect(res.status).toBe(k.status);
      expect(res.body.error.message).toMatch(k.message);
      const detail = (res.body.error.details ?? [])[0];
      if (k.path) expect(detail.path).toBe(k.path);
      if (k.row) expect(detail.row).toBe(k.row);
      expect(await logCount()).toBe(before);
      expect(await importCount()).toBe(imports);
    });
  }

  it('over the size limit (20 MB)', async () => {
    const before = await logCount();
    const big = `${head}\n${`${good}\n`.repeat(Math.ceil((21 * 1024 * 1024) / (good.length + 1)))}`;
    const res = await preview(c.chief, 'big.csv', big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(await logCount()).toBe(before);
  });

  it('hash mismatch at commit', async () => {
    const before = await logCount();
    const p = await preview(c.chief, 'x.csv', `${head}\n${good}`);
    expect(p.status).toBe(200);
    const res = await multipart(c.chief, 'POST', `/api/vessels/${vesselId}/logs/commit`, { name: 'x.csv', content: `${head}\n${good.replace('2000', '2100')}` }, { mapping: p.body.mapping, overwriteChanged: true, fileSha256: p.body.fileSha256 });
    expect(res.status).toBe(409);
    expect(res.body.error.details[0].path).toBe('fileSha256');
    expect(await logCount()).toBe(before);
  });

  it('an ambiguous file imports once the date format is chosen', async () => {
    const content = `${head}\n01/10/2026,DG1,20,9000,2000,BDN-1\n02/10/2026,DG1,20,9000,2000,BDN-1`;
    const p = await preview(c.chief, 'x.csv', content, { mapping: { columns: { date: { field: 'date' }, genset: { field: 'genset' }, hours_run_h: { field: 'hoursRun' }, kwh_produced_kwh: { field: 'kwh' }, fuel_mass_kg: { field: 'fuelMass', unit: 'kg' }, fuel_lot: { field: 'fuelLot' } }, dateFormat: 'dd/mm/yyyy' } });
    expect(p.status).toBe(200);
    expect(p.body.rows.map((r: any) => r.logDate)).toEqual(['2026-10-01', '2026-10-02']);
  });
});

describe('a failure partway through a commit leaves the database as it was', () => {
  it('rolls back every row when the 4th insert fails', async () => {
    const db = app.database.db;
    await db.execute(sql`create sequence intake_fail_seq`);
    await db.execute(sql`create function intake_fail() returns trigger language plpgsql as $$
      begin if nextval('intake_fail_seq') = 4 then raise exception 'forced failure on the 4th insert'; end if; return new; end $$`);
    await db.execute(sql`create trigger intake_fail before insert on genset_daily_logs for each row execute function intake_fail()`);
    try {
      const rows = Array.from({ length: 10 }, (_, i) => `2026-11-${String(i + 1).padStart(2, '0')},DG2,10,4000,920,BDN-1`);
      const content = ['date,genset,hours_run_h,kwh_produced_kwh,fuel_mass_kg,fuel_lot', ...rows].join('\n');
      const before = await logCount();
      const imports = await importCount();
      const [auditBefore] = await db.select({ n: count() }).from(auditLog);
      const res = await commit(c.chief, 'fail.csv', content);
      expect(res.status).toBe(500);
      expect(await logCount()).toBe(before);
      expect(await importCount()).toBe(imports);
      const [auditAfter] = await db.select({ n: count() }).from(auditLog);
      expect(auditAfter.n).toBe(auditBefore.n);
    } finally {
      await db.execute(sql`drop trigger intake_fail on genset_daily_logs`);
      await db.execute(sql`drop function intake_fail()`);
      await db.execute(sql`drop sequence intake_fail_seq`);
    }
  });
});

describe('roles and scope', () => {
  const csv = 'date,genset,hours_run_h,kwh_produced_kwh\n2026-10-05,DG1,10,4000';
  it('energy officer, planner and admin read but do not import or edit', async () => {
    for (const who of ['energy', 'planner', 'admin'] as const) {
      expect((await c[who].get(`/api/vessels/${vesselId}/logs`)).status).toBe(200);
      expect((await c[who].get(`/api/vessels/${vesselId}/log-imports`)).status).toBe(200);
      expect((await c[who].get(`/api/vessels/${vesselId}/fuel-lots`)).status).toBe(200);
      expect((await preview(c[who], 'x.csv', csv)).status).toBe(403);
      expect((await c[who].post(`/api/vessels/${vesselId}/logs`, { gensetId: dg1, logDate: '2026-10-05', hoursRun: 1, kwh: 1 })).status).toBe(403);
      expect((await c[who].post(`/api/vessels/${vesselId}/fuel-lots`, { reference: 'Z', grade: 'MGO', density15KgPerM3: 850, deliveredOn: '2026-05-20' })).status).toBe(403);
      expect((await c[who].post(`/api/vessels/${vesselId}/meter-replacements`, { gensetId: dg1, meter: 'kwh', replacedOn: '2026-10-01', oldFinalReading: 1, newStartReading: 0 })).status).toBe(403);
      expect((await c[who].request('PUT', `/api/vessels/${vesselId}/mode-hours/2026-10-05`, { seaH: 1 })).status).toBe(403);
    }
  });

  it('a chief engineer acts on own vessels only; another company sees nothing', async () => {
    const notOwn = t.vesselIds[1];
    expect((await c.chief.get(`/api/vessels/${notOwn}/logs`)).status).toBe(404);
    expect((await preview(c.chief, 'x.csv', csv, {}, notOwn)).status).toBe(404);
    expect((await c.super.get(`/api/vessels/${notOwn}/logs`)).status).toBe(200);
    expect((await c.otherSuper.get(`/api/vessels/${vesselId}/logs`)).status).toBe(404);
    expect((await preview(c.otherSuper, 'x.csv', csv)).status).toBe(404);
    expect((await c.otherSuper.get(`/api/vessels/${vesselId}/log-imports`)).status).toBe(404);
    const signedOut = app.client();
    expect((await signedOut.get(`/api/vessels/${vesselId}/logs`)).status).toBe(401);
  });
});

describe('nothing lost through the COPY path', () => {
  it('stores remarks with tabs, backslashes, line breaks, quotes and non-ASCII text exactly', async () => {
    const remarks = ['tab\there', 'back\\slash \\N not null', 'two\nlines\r\nand CR', 'say "hi", ok', 'Überdruck ⚠ 45 °C'];
    const quote = (s: string) => `"${s.replace(/"/g, '""')}"`;
    const csv = [
      'date,genset,hours_run_h,kwh_produced_kwh,fuel_mass_kg,fuel_lot,remarks',
      ...remarks.map((r, i) => `2026-09-1${i},DG2,10,4000,880,BDN-1,${quote(r)}`),
    ].join('\n');
    const res = await commit(c.chief, 'remarks.csv', csv);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const rows = await app.database.db
      .select({ logDate: gensetDailyLogs.logDate, remarks: gensetDailyLogs.remarks, kwh: gensetDailyLogs.kwh, fuelMassKg: gensetDailyLogs.fuelMassKg })
      .from(gensetDailyLogs)
      .where(sql`${gensetDailyLogs.gensetId} = ${dg2} and ${gensetDailyLogs.logDate} between '2026-09-10' and '2026-09-14'`)
      .orderBy(gensetDailyLogs.logDate);
    expect(rows.map((r) => r.remarks)).toEqual(remarks);
    expect(rows.every((r) => r.kwh === 4000 && r.fuelMassKg === 880)).toBe(true);
  });
});

describe('a stopped set logged by volume', () => {
  it('a day with 0 L and no temperature keeps its meters, so the next running day is derived', async () => {
    const csv = [
      'date,genset,running_hours_meter_h,kwh_meter_kwh,fuel_volume_l,fuel_temp_c,fuel_lot',
      '2026-09-20,DG2,2000,90000,,,BDN-1',
      '2026-09-21,DG2,2000,90000,0,,BDN-1',
      '2026-09-22,DG2,2010,94000,1100,40,BDN-1',
    ].join('\n');
    const res = await commit(c.chief, 'stopped.csv', csv);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const list = await c.chief.get(`/api/vessels/${vesselId}/logs?gensetId=${dg2}&from=2026-09-21&to=2026-09-22&sort=logDate&dir=asc`);
    const [stopped, running] = list.body.rows;
    expect(stopped.derived).toMatchObject({ hoursRun: 0, kwh: 0 });
    expect(running.derived).toMatchObject({ hoursRun: 10, kwh: 4000 });
    expect(running.derived.fuelKgAt15).toBeGreaterThan(0);
  });
});
