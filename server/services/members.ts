import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { LIMITS } from '../../shared/limits';
import { ROLE_LABELS } from '../../shared/roles';
import type { Invitation, Member } from '../../shared/schemas/users';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { invitations, memberships, membershipVessels, users, vessels } from '../db/schema';
import { AppError, notFound } from '../errors';
import { newOneTimeToken } from '../lib/tokens';
import { recordAudit } from './audit';
import { revokeAllSessions } from './sessions';

async function assertCompanyVessels(db: DbOrTx, actor: Actor, vesselIds: string[]): Promise<void> {
  if (!vesselIds.length) return;
  const found = await db
    .select({ id: vessels.id })
    .from(vessels)
    .where(and(eq(vessels.companyId, actor.companyId), inArray(vessels.id, vesselIds)));
  if (found.length !== new Set(vesselIds).size) {
    throw new AppError('validation_failed', 'One of the chosen vessels is not in your company', [{ path: 'vesselIds', message: 'Unknown vessel' }]);
  }
}

export async function listMembers(deps: AppDeps, actor: Actor): Promise<Member[]> {
  const rows = await deps.db
    .select({ m: memberships, u: users })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.companyId, actor.companyId))
    .orderBy(users.name);
  const scoped = rows.filter((r) => r.m.vesselScoped).map((r) => r.m.id);
  const links = scoped.length ? await deps.db.select().from(membershipVessels).where(inArray(membershipVessels.membershipId, scoped)) : [];
  return rows.map((r) => ({
    membershipId: r.m.id,
    userId: r.u.id,
    email: r.u.email,
    name: r.u.name,
    role: r.m.role,
    vesselIds: r.m.vesselScoped ? links.filter((l) => l.membershipId === r.m.id).map((l) => l.vesselId) : null,
    createdAt: r.m.createdAt.toISOString(),
  }));
}

async function membershipOf(db: DbOrTx, actor: Actor, membershipId: string) {
  const [m] = await db.select().from(memberships).where(and(eq(memberships.id, membershipId), eq(memberships.companyId, actor.companyId)));
  if (!m) throw notFound('Member');
  return m;
}

async function assertAnotherAdminRemains(db: DbOrTx, actor: Actor, membershipId: string): Promise<void> {
  const admins = await db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.companyId, actor.companyId), eq(memberships.role, 'admin')));
  if (admins.every((a) => a.id === membershipId)) {
    throw new AppError('conflict', 'A company keeps at least one administrator');
  }
}

export async function updateMember(deps: AppDeps, actor: Actor, membershipId: string, input: { role: Member['role']; vesselIds: string[] }): Promise<Member> {
  await deps.db.transaction(async (tx) => {
    const before = await membershipOf(tx, actor, membershipId);
    if (before.role === 'admin' && input.role !== 'admin') await assertAnotherAdminRemains(tx, actor, membershipId);
    await assertCompanyVessels(tx, actor, input.vesselIds);
    const beforeVessels = await tx.select().from(membershipVessels).where(eq(membershipVessels.membershipId, membershipId));
    await tx.update(memberships).set({ role: input.role, vesselScoped: input.vesselIds.length > 0 }).where(eq(memberships.id, membershipId));
    await tx.delete(membershipVessels).where(eq(membershipVessels.membershipId, membershipId));
    if (input.vesselIds.length) await tx.insert(membershipVessels).values(input.vesselIds.map((vesselId) => ({ membershipId, vesselId })));
    await recordAudit(tx, actor, 'membership', membershipId, 'update', { role: before.role, vesselIds: beforeVessels.map((v) => v.vesselId) }, input);
  });
  const member = (await listMembers(deps, actor)).find((m) => m.membershipId === membershipId);
  if (!member) throw notFound('Member');
  return member;
}

export async function removeMember(deps: AppDeps, actor: Actor, membershipId: string): Promise<void> {
  if (membershipId === actor.membershipId) throw new AppError('conflict', 'You cannot remove yourself');
  const userId = await deps.db.transaction(async (tx) => {
    const before = await membershipOf(tx, actor, membershipId);
    if (before.role === 'admin') await assertAnotherAdminRemains(tx, actor, membershipId);
    await tx.delete(memberships).where(eq(memberships.id, membershipId));
    await recordAudit(tx, actor, 'membership', membershipId, 'delete', before, null);
    return before.userId;
  });
  await revokeAllSessions(deps, userId);
}

function invitationStatus(row: typeof invitations.$inferSelect, now: Date): Invitation['status'] {
  if (row.acceptedAt) return 'accepted';
  if (row.revokedAt) return 'revoked';
  if (row.expiresAt <= now) return 'expired';
  return 'pending';
}

function toInvitation(row: typeof invitations.$inferSelect, now: Date): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    vesselIds: row.vesselIds,
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    status: invitationStatus(row, now),
  };
}

export async function listInvitations(deps: AppDeps, actor: Actor): Promise<Invitation[]> {
  const rows = await deps.db.select().from(invitations).where(eq(invitations.companyId, actor.companyId)).orderBy(desc(invitations.createdAt));
  return rows.map((r) => toInvitation(r, deps.now()));
}

export async function createInvitation(
  deps: AppDeps,
  actor: Actor,
  input: { email: string; role: Member['role']; vesselIds: string[] },
  origin: string,
): Promise<Invitation> {
  const { token, hash } = newOneTimeToken();
  const row = await deps.db.transaction(async (tx) => {
    await assertCompanyVessels(tx, actor, input.vesselIds);
    const [member] = await tx
      .select({ id: memberships.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, actor.companyId), sql`lower(${users.email}) = ${input.email}`));
    if (member) throw new AppError('conflict', `${input.email} is a member already`, [{ path: 'email', message: 'Already a member' }]);
    // A new invitation replaces any open one for the same address.
    await tx
      .update(invitations)
      .set({ revokedAt: deps.now() })
      .where(and(eq(invitations.companyId, actor.companyId), eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const [created] = await tx
      .insert(invitations)
      .values({
        companyId: actor.companyId,
        email: input.email,
        role: input.role,
        vesselIds: input.vesselIds,
        tokenHash: hash,
        invitedBy: actor.userId,
        expiresAt: new Date(deps.now().getTime() + LIMITS.invitationHours * 3600_000),
      })
      .returning();
    await recordAudit(tx, actor, 'invitation', created.id, 'create', null, { email: created.email, role: created.role, vesselIds: created.vesselIds });
    return created;
  });
  await deps.mailer.send(deps.db, {
    companyId: actor.companyId,
    to: input.email,
    subject: `${actor.name} invites you to Kilowatch (${actor.companyName})`,
    text: [
      'Hello,',
      '',
      `${actor.name} invites you to join ${actor.companyName} on Kilowatch as ${ROLE_LABELS[input.role]}.`,
      'Open this link to choose your name and password:',
      `${origin}/accept-invitation?token=${token}`,
      '',
      `The link works once and expires in ${LIMITS.invitationHours} hours.`,
    ].join('\n'),
  });
  return toInvitation(row, deps.now());
}

export async function revokeInvitation(deps: AppDeps, actor: Actor, invitationId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const [row] = await tx.select().from(invitations).where(and(eq(invitations.id, invitationId), eq(invitations.companyId, actor.companyId)));
    if (!row) throw notFound('Invitation');
    if (row.acceptedAt) throw new AppError('conflict', 'This invitation has been accepted already');
    await tx.update(invitations).set({ revokedAt: deps.now() }).where(eq(invitations.id, invitationId));
    await recordAudit(tx, actor, 'invitation', invitationId, 'revoke', { status: 'pending' }, { status: 'revoked' });
  });
}
