import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTenant, startTestApp, type Tenant, type TestApp } from '../setup/test-app';

let app: TestApp;
let tenant: Tenant;

beforeAll(async () => {
  app = await startTestApp();
  tenant = await createTenant(app, 'Fulmar Tankers');
});
afterAll(() => app?.close());

function tokenFrom(text: string, path: string): string {
  const m = text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[1];
}

describe('invitation through the fake mail server', () => {
  it('invites, delivers over SMTP, accepts once, and signs the new user in with the invited role and vessels', async () => {
    const admin = app.client();
    await admin.signIn(tenant.emails.admin);
    const created = await admin.post('/api/invitations', { email: 'new.chief@fulmar.example', role: 'chief_engineer', vesselIds: [tenant.vesselIds[1]] });
    expect(created.status).toBe(201);
    expect(created.body.status).toBe('pending');

    const mail = await app.mail.waitFor((m) => m.to.includes('new.chief@fulmar.example'));
    expect(mail.subject).toMatch(/invites you to Kilowatch/);
    const token = tokenFrom(mail.text, '/accept-invitation');

    const outbox = await admin.get('/api/outbox');
    expect(outbox.body.some((m: { toAddress: string; status: string }) => m.toAddress === 'new.chief@fulmar.example' && m.status === 'sent')).toBe(true);

    const anon = app.client();
    const preview = await anon.get(`/api/auth/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ email: 'new.chief@fulmar.example', role: 'chief_engineer', companyName: 'Fulmar Tankers' });

    const weak = await anon.post('/api/auth/accept-invitation', { token, name: 'New Chief', password: 'short' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.details[0].path).toBe('password');

    const accepted = await anon.post('/api/auth/accept-invitation', { token, name: 'New Chief', password: 'a long enough password' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.role).toBe('chief_engineer');
    expect(accepted.body.vesselIds).toEqual([tenant.vesselIds[1]]);
    const vessels = await anon.get('/api/vessels');
    expect(vessels.body.map((v: { id: string }) => v.id)).toEqual([tenant.vesselIds[1]]);

    const again = await app.client().post('/api/auth/accept-invitation', { token, name: 'Someone', password: 'a long enough password' });
    expect(again.status).toBe(404);
  });

  it('an expired invitation cannot be used', async () => {
    const admin = app.client();
    await admin.signIn(tenant.emails.admin);
    await admin.post('/api/invitations', { email: 'late@fulmar.example', role: 'planner' });
    const mail = await app.mail.waitFor((m) => m.to.includes('late@fulmar.example'));
    const token = tokenFrom(mail.text, '/accept-invitation');
    app.advance(73 * 3600_000);
    const res = await app.client().post('/api/auth/accept-invitation', { token, name: 'Late', password: 'a long enough password' });
    expect(res.status).toBe(404);
    const list = await (async () => {
      const a = app.client();
      await a.signIn(tenant.emails.admin);
      return a.get('/api/invitations');
    })();
    expect(list.body.find((i: { email: string }) => i.email === 'late@fulmar.example').status).toBe('expired');
  });

  it('a revoked invitation cannot be used', async () => {
    const admin = app.client();
    await admin.signIn(tenant.emails.admin);
    const created = await admin.post('/api/invitations', { email: 'revoked@fulmar.example', role: 'planner' });
    const mail = await app.mail.waitFor((m) => m.to.includes('revoked@fulmar.example'));
    expect((await admin.delete(`/api/invitations/${created.body.id}`)).status).toBe(204);
    const res = await app.client().get(`/api/auth/invitations/${tokenFrom(mail.text, '/accept-invitation')}`);
    expect(res.status).toBe(404);
  });

  it('a chief engineer invitation without vessels is refused', async () => {
    const admin = app.client();
    await admin.signIn(tenant.emails.admin);
    const res = await admin.post('/api/invitations', { email: 'c@fulmar.example', role: 'chief_engineer', vesselIds: [] });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('vesselIds');
  });
});

describe('password reset through the fake mail server', () => {
  it('says the same for known and unknown addresses and mails only the known one', async () => {
    const before = app.mail.messages.length;
    const unknown = await app.client().post('/api/auth/forgot-password', { email: 'ghost@fulmar.example' });
    const known = await app.client().post('/api/auth/forgot-password', { email: tenant.emails.planner });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await app.mail.waitFor((m) => m.to.includes(tenant.emails.planner) && /Reset/.test(m.subject));
    expect(app.mail.messages.slice(before).some((m) => m.to.includes('ghost@fulmar.example'))).toBe(false);
  });

  it('resets the password once, revokes old sessions, and the new password signs in', async () => {
    const email = tenant.emails.superintendent;
    const old = app.client();
    await old.signIn(email);
    const start = app.mail.messages.length;
    await app.client().post('/api/auth/forgot-password', { email });
    const mail = await app.mail.waitFor((m) => m.to.includes(email) && app.mail.messages.indexOf(m) >= start);
    const token = tokenFrom(mail.text, '/reset-password');
    expect((await app.client().post('/api/auth/reset-password', { token, password: 'a brand new password' })).status).toBe(204);
    expect((await old.get('/api/auth/me')).status).toBe(401);
    expect((await app.client().signIn(email)).status).toBe(401);
    expect((await app.client().signIn(email, 'a brand new password')).status).toBe(200);
    const reuse = await app.client().post('/api/auth/reset-password', { token, password: 'yet another password' });
    expect(reuse.status).toBe(400);
  });

  it('an expired reset link is refused', async () => {
    const email = tenant.emails.planner;
    const start = app.mail.messages.length;
    await app.client().post('/api/auth/forgot-password', { email });
    const mail = await app.mail.waitFor((m) => m.to.includes(email) && app.mail.messages.indexOf(m) >= start);
    app.advance(3 * 3600_000);
    const res = await app.client().post('/api/auth/reset-password', { token: tokenFrom(mail.text, '/reset-password'), password: 'a brand new password' });
    expect(res.status).toBe(400);
  });
});
