import { Router } from 'express';
import {
  acceptInvitationSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
} from '../../shared/schemas/auth';
import type { AppDeps } from '../context';
import { parseBody } from '../lib/parse';
import { actorOf, clearSessionCookie, setSessionCookie } from '../middleware/auth';
import { publicOrigin } from '../middleware/origin';
import { acceptInvitation, forgotPassword, loadActor, previewInvitation, resetPassword, signIn, toMe } from '../services/auth';
import { revokeSession, verifySession } from '../services/sessions';

export function authRouter(deps: AppDeps): Router {
  const r = Router();

  r.post('/sign-in', async (req, res) => {
    const input = parseBody(signInSchema, req.body);
    const issued = await signIn(deps, input.email, input.password, req.ip ?? 'unknown');
    const session = await verifySession(deps, issued.token);
    const actor = session && (await loadActor(deps, session));
    if (!actor) throw new Error('a session just issued could not be read back');
    setSessionCookie(deps, res, issued.token, issued.expiresAt);
    res.json(toMe(actor));
  });

  r.post('/sign-out', async (req, res) => {
    if (req.actor) await revokeSession(deps, req.actor.sessionId);
    clearSessionCookie(deps, res);
    res.status(204).end();
  });

  r.get('/me', (req, res) => {
    res.json(toMe(actorOf(req)));
  });

  r.post('/forgot-password', async (req, res) => {
    const input = parseBody(forgotPasswordSchema, req.body);
    await forgotPassword(deps, input.email, publicOrigin(deps, req));
    res.status(202).json({ ok: true, message: 'If the address belongs to a Kilowatch user, a reset link is on its way.' });
  });

  r.post('/reset-password', async (req, res) => {
    await resetPassword(deps, parseBody(resetPasswordSchema, req.body));
    res.status(204).end();
  });

  r.get('/invitations/:token', async (req, res) => {
    res.json(await previewInvitation(deps, String(req.params.token)));
  });

  r.post('/accept-invitation', async (req, res) => {
    const issued = await acceptInvitation(deps, parseBody(acceptInvitationSchema, req.body));
    const session = await verifySession(deps, issued.token);
    const actor = session && (await loadActor(deps, session));
    if (!actor) throw new Error('a session just issued could not be read back');
    setSessionCookie(deps, res, issued.token, issued.expiresAt);
    res.status(201).json(toMe(actor));
  });

  return r;
}
