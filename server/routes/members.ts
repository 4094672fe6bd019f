import { Router } from 'express';
import { createInvitationSchema, updateMemberSchema } from '../../shared/schemas/users';
import type { AppDeps } from '../context';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import { publicOrigin } from '../middleware/origin';
import { createInvitation, listInvitations, listMembers, removeMember, revokeInvitation, updateMember } from '../services/members';

export function membersRouter(deps: AppDeps): Router {
  const r = Router();
  // Guard each route (a router-level `use` would also catch requests meant for routers mounted after this one).
  const admin = requireCapability('users:manage');

  r.get('/members', admin, async (req, res) => {
    res.json(await listMembers(deps, actorOf(req)));
  });
  r.patch('/members/:membershipId', admin, async (req, res) => {
    const input = parseBody(updateMemberSchema, req.body, 'member');
    res.json(await updateMember(deps, actorOf(req), idParam(req.params.membershipId, 'Member'), input));
  });
  r.delete('/members/:membershipId', admin, async (req, res) => {
    await removeMember(deps, actorOf(req), idParam(req.params.membershipId, 'Member'));
    res.status(204).end();
  });

  r.get('/invitations', admin, async (req, res) => {
    res.json(await listInvitations(deps, actorOf(req)));
  });
  r.post('/invitations', admin, async (req, res) => {
    const input = parseBody(createInvitationSchema, req.body, 'invitation');
    res.status(201).json(await createInvitation(deps, actorOf(req), input, publicOrigin(deps, req)));
  });
  r.delete('/invitations/:invitationId', admin, async (req, res) => {
    await revokeInvitation(deps, actorOf(req), idParam(req.params.invitationId, 'Invitation'));
    res.status(204).end();
  });
  return r;
}
