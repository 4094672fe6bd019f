import { and, eq, gt, isNull } from 'drizzle-orm';
import { jwtVerify, SignJWT } from 'jose';
import type { AppDeps } from '../context';
import { sessions } from '../db/schema';

export const SESSION_COOKIE = 'kw_session';
const ISSUER = 'kilowatch';

export interface IssuedSession {
  token: string;
  sessionId: string;
  expiresAt: Date;
}

/** Records a session and signs a JWT (HS256) naming it; the JWT expires with the session. */
export async function createSession(deps: AppDeps, userId: string, companyId: string): Promise<IssuedSession> {
  const expiresAt = new Date(deps.now().getTime() + deps.config.sessionHours * 3600_000);
  const [row] = await deps.db.insert(sessions).values({ userId, companyId, expiresAt }).returning({ id: sessions.id });
  return { token: await sign(deps, row.id, userId, companyId, expiresAt), sessionId: row.id, expiresAt };
}

async function sign(deps: AppDeps, sessionId: string, userId: string, companyId: string, expiresAt: Date): Promise<string> {
  return new SignJWT({ cid: companyId })
    .setProtectedHeader({ alg: 'HS256' })
    .setIssuer(ISSUER)
    .setSubject(userId)
    .setJti(sessionId)
    .setIssuedAt(Math.floor(deps.now().getTime() / 1000))
    .setExpirationTime(Math.floor(expiresAt.getTime() / 1000))
    .sign(deps.config.sessionSecret);
}

export interface VerifiedSession {
  sessionId: string;
  userId: string;
  companyId: string;
  expiresAt: Date;
}

/**
 * Checks the signature, issuer and expiry of the JWT, then that its session is still on record and not revoked.
 * Returns null for anything wrong (forged, expired, revoked), never throws.
 */
export async function verifySession(deps: AppDeps, token: string): Promise<VerifiedSession | null> {
  let payload;
  try {
    ({ payload } = await jwtVerify(token, deps.config.sessionSecret, {
      issuer: ISSUER,
      algorithms: ['HS256'],
      currentDate: deps.now(),
    }));
  } catch {
    return null;
  }
  if (typeof payload.jti !== 'string' || typeof payload.sub !== 'string' || typeof payload.cid !== 'string') return null;
  const [row] = await deps.db
    .select()
    .from(sessions)
    .where(and(eq(sessions.id, payload.jti), isNull(sessions.revokedAt), gt(sessions.expiresAt, deps.now())));
  if (!row || row.userId !== payload.sub || row.companyId !== payload.cid) return null;
  return { sessionId: row.id, userId: row.userId, companyId: row.companyId, expiresAt: row.expiresAt };
}

/** Sliding renewal: past half its life a session is extended and a new token issued. */
export async function renewIfDue(deps: AppDeps, s: VerifiedSession): Promise<IssuedSession | null> {
  const lifeMs = deps.config.sessionHours * 3600_000;
  if (s.expiresAt.getTime() - deps.now().getTime() > lifeMs / 2) return null;
  const expiresAt = new Date(deps.now().getTime() + lifeMs);
  await deps.db.update(sessions).set({ expiresAt }).where(eq(sessions.id, s.sessionId));
  return { token: await sign(deps, s.sessionId, s.userId, s.companyId, expiresAt), sessionId: s.sessionId, expiresAt };
}

export async function revokeSession(deps: AppDeps, sessionId: string): Promise<void> {
  await deps.db.update(sessions).set({ revokedAt: deps.now() }).where(eq(sessions.id, sessionId));
}

export async function revokeAllSessions(deps: AppDeps, userId: string): Promise<void> {
  await deps.db
    .update(sessions)
    .set({ revokedAt: deps.now() })
    .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt)));
}
