import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { can, type Capability } from '../../shared/roles';
import type { Actor, AppDeps } from '../context';
import { AppError, forbidden } from '../errors';
import { loadActor } from '../services/auth';
import { renewIfDue, SESSION_COOKIE, verifySession } from '../services/sessions';

declare module 'express-serve-static-core' {
  interface Request {
    actor?: Actor;
  }
}

export function readCookie(req: Request, name: string): string | null {
  const header = req.headers.cookie;
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    if (part.slice(0, eq).trim() === name) {
      try {
        return decodeURIComponent(part.slice(eq + 1).trim());
      } catch {
        return null;
      }
    }
  }
  return null;
}

export function setSessionCookie(deps: AppDeps, res: Response, token: string, expiresAt: Date): void {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: deps.config.cookieSecure,
    path: '/',
    expires: expiresAt,
  });
}

export function clearSessionCookie(deps: AppDeps, res: Response): void {
  res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure: deps.config.cookieSecure, path: '/' });
}

/** Resolves the session cookie into `req.actor` (or leaves it unset); renews a session past half its life. */
export function sessionMiddleware(deps: AppDeps): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const token = readCookie(req, SESSION_COOKIE);
    if (token) {
      const session = await verifySession(deps, token);
      if (session) {
        const actor = await loadActor(deps, session);
        if (actor) {
          const renewed = await renewIfDue(deps, session);
          if (renewed) {
            setSessionCookie(deps, res, renewed.token, renewed.expiresAt);
            actor.sessionExpiresAt = renewed.expiresAt;
          }
          req.actor = actor;
        }
      }
    }
    next();
  };
}

/** The signed-in actor, or a 401. */
export function actorOf(req: Request): Actor {
  if (!req.actor) throw new AppError('unauthenticated', 'Sign in to continue');
  return req.actor;
}

/** Route guard: signed in and the role has the capability. */
export function requireCapability(capability: Capability): RequestHandler {
  return (req, _res, next) => {
    const actor = actorOf(req);
    if (!can(actor.role, capability)) throw forbidden();
    next();
  };
}

export const requireSignIn: RequestHandler = (req, _res, next) => {
  actorOf(req);
  next();
};
