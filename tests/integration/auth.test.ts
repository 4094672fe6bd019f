import { SignJWT } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LIMITS } from '../../shared/limits';
import { createTenant, startTestApp, TEST_PASSWORD, type Tenant, type TestApp } from '../setup/test-app';

let app: TestApp;
let tenant: Tenant;

beforeAll(async () => {
  app = await startTestApp();
  tenant = await createTenant(app, 'Gannet Lines');
});
afterAll(() => app?.close());

describe('health', () => {
  it('answers with the database state', async () => {
    const res = await app.client().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });
});

describe('sign-in', () => {
  it('signs in with the right password and sets an httpOnly SameSite=Lax cookie', async () => {
    const c = app.client();
    const res = await c.signIn(tenant.emails.admin);
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('admin');
    expect(res.body.company.name).toBe('Gannet Lines');
    const cookie = res.headers.get('set-cookie') ?? '';
    expect(cookie).toMatch(/kw_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(tenant.emails.admin);
  });

  it('accepts the e-mail in any letter case', async () => {
    const res = await app.client().signIn(tenant.emails.planner.toUpperCase());
    expect(res.status).toBe(200);
  });

  it('answers the same for a wrong password as for an unknown e-mail', async () => {
    const wrong = await app.client().signIn(tenant.emails.planner, 'not the password at all');
    const unknown = await app.client().signIn('nobody@nowhere.example', 'not the password at all');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('unauthenticated');
  });

  it('rejects a malformed body with a field error', async () => {
    const res = await app.client().post('/api/auth/sign-in', { email: 'not-an-email', password: '' });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('rate-limits repeated failures for one e-mail', async () => {
    const email = tenant.emails.energy_officer;
    for (let i = 0; i < LIMITS.signInAttemptsPerEmail; i++) {
      expect((await app.client().signIn(email, 'wrong password here')).status).toBe(401);
    }
    const blocked = await app.client().signIn(email, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    app.advance((LIMITS.signInWindowMinutes + 1) * 60_000);
    expect((await app.client().signIn(email)).status).toBe(200);
  });
});

describe('session tokens', () => {
  it('refuses a request without a session', async () => {
    const res = await app.client().get('/api/vessels');
    expect(res.status).toBe(401);
  });

  it('refuses a forged token signed with another key', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.admin);
    const me = await c.get('/api/auth/me');
    const forged = await new SignJWT({ cid: me.body.company.id })
      .setProtectedHeader({ alg: 'HS256' })
      .setIssuer('kilowatch')
      .setSubject(me.body.user.id)
      .setJti('00000000-0000-4000-8000-000000000000')
      .setExpirationTime('1h')
      .sign(new TextEncoder().encode('some-other-secret-some-other-secret-1234'));
    const f = app.client();
    f.cookie = `kw_session=${forged}`;
    expect((await f.get('/api/auth/me')).status).toBe(401);
  });

  it('refuses a token whose signature was tampered with', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.admin);
    const token = c.cookie!.split('=')[1];
    const [h, p, s] = token.split('.');
    const t = app.client();
    t.cookie = `kw_session=${h}.${p}.${s.slice(0, -2)}${s.endsWith('AA') ? 'BB' : 'AA'}`;
    expect((await t.get('/api/auth/me')).status).toBe(401);
  });

  it('refuses an expired token', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.superintendent);
    app.advance(13 * 3600_000);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('renews a session past half its life', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.superintendent);
    const first = (await c.get('/api/auth/me')).body.sessionExpiresAt;
    const before = c.cookie;
    app.advance(7 * 3600_000);
    const res = await c.get('/api/auth/me');
    expect(res.status).toBe(200);
    expect(c.cookie).not.toBe(before);
    expect(new Date(res.body.sessionExpiresAt).getTime()).toBeGreaterThan(new Date(first).getTime());
  });

  it('sign-out revokes the token even if it is replayed', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.admin);
    const stolen = c.cookie;
    expect((await c.post('/api/auth/sign-out')).status).toBe(204);
    const replay = app.client();
    replay.cookie = stolen;
    expect((await replay.get('/api/auth/me')).status).toBe(401);
  });
});

describe('CSRF: Origin check on state-changing requests', () => {
  it('refuses a POST from another origin and one with no origin', async () => {
    const c = app.client();
    await c.signIn(tenant.emails.admin);
    const cross = await c.request('POST', '/api/invitations', { email: 'x@y.example', role: 'planner' }, { origin: 'https://evil.example' });
    expect(cross.status).toBe(403);
    const res = await fetch(`${app.baseUrl}/api/invitations`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie: c.cookie! },
      body: JSON.stringify({ email: 'x@y.example', role: 'planner' }),
    });
    expect(res.status).toBe(403);
    const list = await c.get('/api/invitations');
    expect(list.body).toHaveLength(0);
  });
});
