import argon2 from 'argon2';
import { and, asc, count, eq, gt, isNull, sql } from 'drizzle-orm';
import { LIMITS } from '../../shared/limits';
import type { AcceptInvitationInput, InvitationPreview, Me, ResetPasswordInput } from '../../shared/schemas/auth';
import type { Actor, AppDeps } from '../context';
import { companies, invitations, memberships, membershipVessels, passwordResets, signInAttempts, users } from '../db/schema';
import { AppError } from '../errors';
import { hashToken, newOneTimeToken } from '../lib/tokens';
import { recordAudit } from './audit';
import { createSession, revokeAllSessions, type IssuedSession, type VerifiedSession } from './sessions';

const ARGON2 = { type: argon2.argon2id } as const;
/** Verified against when the e-mail is unknown, so both answers take about as long. */
let dummyHash: Promise<string> | null = null;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2);
}

const WRONG = () => new AppError('unauthenticated', 'E-mail or password is wrong');

async function rateLimit(deps: AppDeps, email: string, address: string): Promise<void> {
  const since = new Date(deps.now().getTime() - LIMITS.signInWindowMinutes * 60_000);
  const counts = await deps.db
    .select({ key: signInAttempts.key, n: count() })
    .from(signInAttempts)
    .where(and(sql`${signInAttempts.key} in (${`email:${email}`}, ${`addr:${address}`})`, gt(signInAttempts.at, since)))
    .groupBy(signInAttempts.key);
  const byKey = new Map(counts.map((c) => [c.key, Number(c.n)]));
  if ((byKey.get(`email:${email}`) ?? 0) >= LIMITS.signInAttemptsPerEmail || (byKey.get(`addr:${address}`) ?? 0) >= LIMITS.signInAttemptsPerAddress) {
    throw new AppError('rate_limited', `Too many sign-in attempts; try again in ${LIMITS.signInWindowMinutes} minutes`);
  }
}

async function recordFailure(deps: AppDeps, email: string, address: string): Promise<void> {
  await deps.db.insert(signInAttempts).values([
    { key: `email:${email}`, at: deps.now() },
    { key: `addr:${address}`, at: deps.now() },
  ]);
}

/** Checks e-mail and password; answers the same for an unknown e-mail as for a wrong password. */
export async function signIn(deps: AppDeps, email: string, password: string, address: string): Promise<IssuedSession> {
  await rateLimit(deps, email, address);
  const [user] = await deps.db.select().from(users).where(sql`lower(${users.email}) = ${email.toLowerCase()}`);
  dummyHash ??= argon2.hash('kilowatch-timing-equaliser', ARGON2);
  const hash = user?.passwordHash ?? (await dummyHash);
  const ok = await argon2.verify(hash, password).catch(() => false);
  if (!user || !user.passwordHash || !ok || user.disabledAt) {
    await recordFailure(deps, email, address);
    throw WRONG();
  }
  const [membership] = await deps.db
    .select()
    .from(memberships)
    .where(eq(memberships.userId, user.id))
    .orderBy(asc(memberships.createdAt))
    .limit(1);
  if (!membership) {
    await recordFailure(deps, email, address);
    throw WRONG();
  }
  await deps.db.delete(signInAttempts).where(eq(signInAttempts.key, `email:${email}`));
  return createSession(deps, user.id, membership.companyId);
}

/** The member behind a verified session, with role and vessel scope read fresh on every request. */
export async function loadActor(deps: AppDeps, s: VerifiedSession): Promise<Actor | null> {
  const [row] = await deps.db
    .select({ user: users, membership: memberships, company: companies })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(companies, eq(companies.id, memberships.companyId))
    .where(and(eq(memberships.userId, s.userId), eq(memberships.companyId, s.companyId)));
  if (!row || row.user.disabledAt) return null;
  let vesselIds: string[] | null = null;
  if (row.membership.vesselScoped) {
    const scoped = await deps.db
      .select({ vesselId: membershipVessels.vesselId })
      .from(membershipVessels)
      .where(eq(membershipVessels.membershipId, row.membership.id));
    vesselIds = scoped.map((v) => v.vesselId);
  }
  return {
    userId: row.user.id,
    email: row.user.email,
    name: row.user.name,
    companyId: row.company.id,
    companyName: row.company.name,
    currency: row.company.currency,
    membershipId: row.membership.id,
    role: row.membership.role,
    vesselIds,
    sessionId: s.sessionId,
    sessionExpiresAt: s.expiresAt,
  };
}

export function toMe(actor: Actor): Me {
  return {
    user: { id: actor.userId, email: actor.email, name: actor.name },
    company: { id: actor.companyId, name: actor.companyName, currency: actor.currency },
    role: actor.role,
    vesselIds: actor.vesselIds,
    sessionExpiresAt: actor.sessionExpiresAt.toISOString(),
  };
}

/** Sends a reset link when the e-mail belongs to a user; says nothing either way. */
export async function forgotPassword(deps: AppDeps, email: string, origin: string): Promise<void> {
  const [user] = await deps.db.select().from(users).where(sql`lower(${users.email}) = ${email.toLowerCase()}`);
  if (!user || user.disabledAt) return;
  const { token, hash } = newOneTimeToken();
  await deps.db.insert(passwordResets).values({
    userId: user.id,
    tokenHash: hash,
    expiresAt: new Date(deps.now().getTime() + LIMITS.resetHours * 3600_000),
  });
  const [membership] = await deps.db.select().from(memberships).where(eq(memberships.userId, user.id)).limit(1);
  await deps.mailer.send(deps.db, {
    companyId: membership?.companyId ?? null,
    to: user.email,
    subject: 'Reset your Kilowatch password',
    text: [
      `Hello ${user.name},`,
      '',
      'Someone (we hope you) asked to reset your Kilowatch password. Open this link to choose a new one:',
      `${origin}/reset-password?token=${token}`,
      '',
      `The link works once and expires in ${LIMITS.resetHours} hours. If you did not ask, ignore this e-mail.`,
    ].join('\n'),
  });
}

export async function resetPassword(deps: AppDeps, input: ResetPasswordInput): Promise<void> {
  const invalid = new AppError('bad_request', 'This reset link is invalid or has expired; ask for a new one');
  await deps.db.transaction(async (tx) => {
    const [reset] = await tx
      .select()
      .from(passwordResets)
      .where(and(eq(passwordResets.tokenHash, hashToken(input.token)), isNull(passwordResets.usedAt)))
      .for('update');
    if (!reset || reset.expiresAt <= deps.now()) throw invalid;
    await tx.update(passwordResets).set({ usedAt: deps.now() }).where(eq(passwordResets.id, reset.id));
    await tx.update(users).set({ passwordHash: await hashPassword(input.password), updatedAt: deps.now() }).where(eq(users.id, reset.userId));
  });
  const [reset] = await deps.db.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(input.token)));
  await revokeAllSessions(deps, reset.userId);
}

async function findOpenInvitation(deps: AppDeps, token: string) {
  const [row] = await deps.db
    .select({ invitation: invitations, companyName: companies.name })
    .from(invitations)
    .innerJoin(companies, eq(companies.id, invitations.companyId))
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
  if (!row || row.invitation.expiresAt <= deps.now()) return null;
  return row;
}

export async function previewInvitation(deps: AppDeps, token: string): Promise<InvitationPreview> {
  const row = await findOpenInvitation(deps, token);
  if (!row) throw new AppError('not_found', 'This invitation is invalid, used or expired; ask your administrator for a new one');
  return {
    email: row.invitation.email,
    companyName: row.companyName,
    role: row.invitation.role,
    expiresAt: row.invitation.expiresAt.toISOString(),
  };
}

/** Creates (or completes) the invited user's account and membership, and signs them in. */
export async function acceptInvitation(deps: AppDeps, input: AcceptInvitationInput): Promise<IssuedSession> {
  const row = await findOpenInvitation(deps, input.token);
  if (!row) throw new AppError('not_found', 'This invitation is invalid, used or expired; ask your administrator for a new one');
  const inv = row.invitation;
  const passwordHash = await hashPassword(input.password);
  const userId = await deps.db.transaction(async (tx) => {
    const [locked] = await tx.select().from(invitations).where(eq(invitations.id, inv.id)).for('update');
    if (locked.acceptedAt) throw new AppError('conflict', 'This invitation has already been used');
    let [user] = await tx.select().from(users).where(sql`lower(${users.email}) = ${inv.email.toLowerCase()}`);
    if (user && user.passwordHash) {
      throw new AppError('conflict', 'An account with this e-mail exists already; sign in, or reset its password');
    }
    if (user) {
      [user] = await tx.update(users).set({ name: input.name, passwordHash, updatedAt: deps.now() }).where(eq(users.id, user.id)).returning();
    } else {
      [user] = await tx.insert(users).values({ email: inv.email, name: input.name, passwordHash }).returning();
    }
    const [membership] = await tx
      .insert(memberships)
      .values({ userId: user.id, companyId: inv.companyId, role: inv.role, vesselScoped: inv.vesselIds.length > 0 })
      .onConflictDoNothing()
      .returning();
    if (!membership) throw new AppError('conflict', 'You are a member of this company already');
    if (inv.vesselIds.length) {
      await tx.insert(membershipVessels).values(inv.vesselIds.map((vesselId) => ({ membershipId: membership.id, vesselId })));
    }
    await tx.update(invitations).set({ acceptedAt: deps.now() }).where(eq(invitations.id, inv.id));
    await recordAudit(tx, { companyId: inv.companyId, userId: user.id }, 'membership', membership.id, 'create', null, {
      email: inv.email,
      role: inv.role,
      vesselIds: inv.vesselIds,
    });
    return user.id;
  });
  return createSession(deps, userId, inv.companyId);
}
