import type { RequestHandler } from 'express';
import type { AppDeps } from '../context';
import { AppError } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence in depth beside SameSite=Lax cookies: a state-changing request must come from the app's own origin
 * (the Origin header, or Referer when a browser omits Origin). Requests with neither header are refused too.
 */
export function originCheck(deps: AppDeps): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const allowed = deps.config.appOrigin ?? `${req.protocol}://${req.get('host')}`;
    const origin = req.get('origin') ?? originOfReferer(req.get('referer'));
    if (origin !== allowed) {
      throw new AppError('forbidden', 'This request did not come from the Kilowatch app (Origin check failed)');
    }
    next();
  };
}

function originOfReferer(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return undefined;
  }
}

/** The origin links in e-mails point at. */
export function publicOrigin(deps: AppDeps, req: { protocol: string; get(name: string): string | undefined }): string {
  return deps.config.appOrigin ?? `${req.protocol}://${req.get('host')}`;
}
