/**
 * The job queue (pg-boss on the test database): the monthly report job sends each subscribed report once with
 * the XLSX attached, even with two job-queue instances (as two server processes would run) both triggering the
 * same period; the refit-after-import queue refits through the curves service.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createJobs, QUEUES, type Jobs } from '../../server/jobs/index';
import { deliveries, mailOutbox, memberships, subscriptions } from '../../server/db/schema';
import { deliverMonthlyReports } from '../../server/services/subscriptions';
import { createTenant, startTestApp, type HttpClient, type Tenant, type TestApp } from '../setup/test-app';

const MONTH = '2026-03';
let app: TestApp;
let t: Tenant;
let officer: HttpClient;
let workers: Jobs[] = [];
const finished: { queue: string; result: unknown }[] = [];

async function until(check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error('condition not reached in time');
    await new Promise((r) => setTimeout(r, 200));
  }
}

beforeAll(async () => {
  app = await startTestApp();
  t = await createTenant(app, 'Fulmar Reefers');
  officer = app.client();
  expect((await officer.signIn(t.emails.energy_officer)).status).toBe(200);
  workers = [0, 1].map(() =>
    createJobs(app.deps, app.database.url, { schedule: false, pollingIntervalSeconds: 0.5, onDone: (queue, result) => finished.push({ queue, result }) }),
  );
  // Started one after the other: pg-boss installs its schema on the first start.
  for (const w of workers) await w.start();
}, 60_000);
afterAll(async () => {
  for (const w of workers) await w.stop();
  await app?.close();
});

describe('monthly report job', () => {
  it('sends one e-mail with the XLSX attached when two workers both trigger the same period', async () => {
    const sub = await officer.post('/api/subscriptions', { kind: 'vessel_monthly_report', vesselId: t.vesselIds[0] });
    expect(sub.status).toBe(201);
    await Promise.all(workers.map((w) => w.triggerMonthlyReports(MONTH)));
    await until(() => finished.filter((f) => f.queue === QUEUES.monthlyReports).length >= 2);
    const mail = await app.mail.waitFor((m) => m.to.includes(t.emails.energy_officer) && /savings report 2026-03/.test(m.subject));
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0].filename).toMatch(/\.xlsx$/);
    expect(mail.attachments[0].contentType).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(mail.attachments[0].size).toBeGreaterThan(1000);
    expect(mail.text).toMatch(new RegExp(`/vessels/${t.vesselIds[0]}/report\\?month=${MONTH}`));
    expect(mail.text).toMatch(/Kilowatch advises/);
    const received = app.mail.messages.filter((m) => m.to.includes(t.emails.energy_officer) && /2026-03/.test(m.subject));
    expect(received).toHaveLength(1);
    const rows = await app.database.db.select().from(deliveries).where(eq(deliveries.subscriptionId, sub.body[0].id));
    expect(rows.map((r) => r.deliveryKey)).toEqual([MONTH]);
    const outbox = await app.database.db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, t.emails.energy_officer));
    expect(outbox.filter((m) => m.status === 'sent')).toHaveLength(1);
  }, 60_000);

  it('two deliveries of the same period at the same moment send once (unique delivery row in the sending transaction)', async () => {
    const sup = app.client();
    await sup.signIn(t.emails.superintendent);
    const sub = await sup.post('/api/subscriptions', { kind: 'fleet_monthly_report' });
    expect(sub.status).toBe(201);
    const before = app.mail.messages.length;
    const [x, y] = await Promise.all([deliverMonthlyReports(app.deps, '2026-02'), deliverMonthlyReports(app.deps, '2026-02')]);
    // The SMTP reply comes after the fake server stored the message, so both sends are in by now.
    expect(x.sent + y.sent).toBe(2); // officer's vessel report and superintendent's fleet report, each once
    expect(app.mail.messages.slice(before).filter((m) => m.to.includes(t.emails.superintendent))).toHaveLength(1);
    expect(app.mail.messages.slice(before).filter((m) => m.to.includes(t.emails.energy_officer))).toHaveLength(1);
    const rows = await app.database.db.select().from(deliveries).where(eq(deliveries.subscriptionId, sub.body[0].id));
    expect(rows).toHaveLength(1);
    const fleetMail = await app.mail.waitFor((m) => m.to.includes(t.emails.superintendent) && /Fleet savings/.test(m.subject));
    expect(fleetMail.attachments[0].filename).toBe('kilowatch-fleet-2026-02.xlsx');
  }, 60_000);

  it('skips a subscriber whose role no longer receives the fleet report', async () => {
    const [s] = await app.database.db.select().from(subscriptions).where(eq(subscriptions.kind, 'fleet_monthly_report'));
    await app.database.db.update(memberships).set({ role: 'planner' }).where(eq(memberships.userId, s.userId));
    const before = app.mail.messages.length;
    const count = await deliverMonthlyReports(app.deps, '2026-01');
    expect(count.skipped).toBe(1);
    expect(app.mail.messages.slice(before).filter((m) => /Fleet savings/.test(m.subject))).toHaveLength(0);
  });
});

describe('refit after import', () => {
  it('runs the queued refit through the curves service', async () => {
    await workers[0].enqueueRefit({ companyId: t.companyId, vesselId: t.vesselIds[0] });
    await until(() => finished.some((f) => f.queue === QUEUES.refitAfterImport));
    expect(finished.find((f) => f.queue === QUEUES.refitAfterImport)!.result).toEqual({ refitted: 0 });
  }, 60_000);
});
