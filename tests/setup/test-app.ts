/**
 * The real app in-process for API tests: its own migrated database, the local fake SMTP server, a clock the test
 * can move, and an HTTP client with a cookie jar per signed-in user.
 */
import type { Server } from 'node:http';
import argon2 from 'argon2';
import { createApp } from '../../server/app';
import type { AppDeps } from '../../server/context';
import { companies, memberships, membershipVessels, users, vessels } from '../../server/db/schema';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer } from '../../server/mail/mailer';
import type { Role } from '../../shared/roles';
import { createTestDatabase, type TestDatabase } from './test-db';

export const TEST_PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | null = null;

export interface TestApp {
  baseUrl: string;
  origin: string;
  database: TestDatabase;
  deps: AppDeps;
  mail: FakeSmtp;
  /** Moves the app's clock forward. */
  advance(ms: number): void;
  client(): HttpClient;
  close(): Promise<void>;
}

export interface HttpResponse<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

export interface HttpClient {
  cookie: string | null;
  request<T = any>(method: string, path: string, body?: unknown, headers?: Record<string, string>): Promise<HttpResponse<T>>;
  get<T = any>(path: string): Promise<HttpResponse<T>>;
  post<T = any>(path: string, body?: unknown): Promise<HttpResponse<T>>;
  patch<T = any>(path: string, body?: unknown): Promise<HttpResponse<T>>;
  delete<T = any>(path: string): Promise<HttpResponse<T>>;
  signIn(email: string, password?: string): Promise<HttpResponse<any>>;
}

export async function startTestApp(): Promise<TestApp> {
  const database = await createTestDatabase();
  const mail = await startFakeSmtp(0);
  const mailer = createMailer({ host: '127.0.0.1', port: mail.port, secure: false, from: 'Kilowatch test <test@kilowatch.invalid>' });
  let offsetMs = 0;
  const deps: AppDeps = {
    db: database.db,
    mailer,
    config: {
      sessionSecret: new TextEncoder().encode('test-secret-that-is-long-enough-for-hs256-signing'),
      sessionHours: 12,
      cookieSecure: false,
    },
    now: () => new Date(Date.now() + offsetMs),
  };
  const app = createApp(deps);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const baseUrl = `http://127.0.0.1:${port}`;

  const client = (): HttpClient => {
    const c: HttpClient = {
      cookie: null,
      async request(method, path, body, headers = {}) {
        const res = await fetch(`${baseUrl}${path}`, {
          method,
          headers: {
            ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
            ...(method !== 'GET' ? { origin: baseUrl } : {}),
            ...(c.cookie ? { cookie: c.cookie } : {}),
            ...headers,
          },
          body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
        });
        const setCookie = res.headers.get('set-cookie');
        if (setCookie) {
          const first = setCookie.split(';')[0];
          c.cookie = first.endsWith('=') ? null : first;
        }
        const text = await res.text();
        let parsed: unknown = text;
        try {
          parsed = text ? JSON.parse(text) : null;
        } catch {
          // not JSON
        }
        return { status: res.status, body: parsed as any, headers: res.headers };
      },
      get: (path) => c.request('GET', path),
      post: (path, body) => c.request('POST', path, body ?? {}),
      patch: (path, body) => c.request('PATCH', path, body ?? {}),
      delete: (path) => c.request('DELETE', path),
      signIn: (email, password = TEST_PASSWORD) => c.post('/api/auth/sign-in', { email, password }),
    };
    return c;
  };

  return {
    baseUrl,
    origin: baseUrl,
    database,
    deps,
    mail,
    advance: (ms) => {
      offsetMs += ms;
    },
    client,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      mailer.close();
      await mail.close();
      await database.close();
    },
  };
}

export interface Tenant {
  companyId: string;
  vesselIds: string[];
  /** e-mail by role; the chief engineer is scoped to the first vessel. */
  emails: Record<Role, string>;
}

/** A small company with two vessels and one user per role (password TEST_PASSWORD). */
export async function createTenant(app: TestApp, name: string): Promise<Tenant> {
  passwordHash ??= argon2.hash(TEST_PASSWORD, { type: argon2.argon2id });
  const hash = await passwordHash;
  const db = app.database.db;
  const slug = name.toLowerCase().replace(/[^a-z0-9]+/g, '-');
  const [company] = await db.insert(companies).values({ name }).returning();
  const vesselRows = await db
    .insert(vessels)
    .values([
      { companyId: company.id, name: `${name} One`, imoNumber: String(9100000 + Math.floor(Math.random() * 899999)), vesselType: 'bulk carrier', fuelGrades: ['VLSFO', 'MGO'] },
      { companyId: company.id, name: `${name} Two`, imoNumber: String(9100000 + Math.floor(Math.random() * 899999)), vesselType: 'oil tanker', fuelGrades: ['MGO'] },
    ])
    .returning();
  const roles: Role[] = ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner'];
  const emails = {} as Record<Role, string>;
  for (const role of roles) {
    const email = `${role}@${slug}.example`;
    emails[role] = email;
    const [user] = await db.insert(users).values({ email, name: `${role} of ${name}`, passwordHash: hash }).returning();
    const [m] = await db
      .insert(memberships)
      .values({ userId: user.id, companyId: company.id, role, vesselScoped: role === 'chief_engineer' })
      .returning();
    if (role === 'chief_engineer') await db.insert(membershipVessels).values({ membershipId: m.id, vesselId: vesselRows[0].id });
  }
  return { companyId: company.id, vesselIds: vesselRows.map((v) => v.id), emails };
}
