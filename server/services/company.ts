import { desc, eq } from 'drizzle-orm';
import type { AuditEntry, CompanySettings, OutboxMessage } from '../../shared/schemas/users';
import type { Actor, AppDeps } from '../context';
import { auditLog, companies, mailOutbox, users } from '../db/schema';
import { recordAudit } from './audit';

export async function getCompany(deps: AppDeps, actor: Actor): Promise<CompanySettings> {
  const [row] = await deps.db.select().from(companies).where(eq(companies.id, actor.companyId));
  return { name: row.name, currency: row.currency };
}

export async function updateCompany(deps: AppDeps, actor: Actor, input: CompanySettings): Promise<CompanySettings> {
  return deps.db.transaction(async (tx) => {
    const [before] = await tx.select().from(companies).where(eq(companies.id, actor.companyId));
    const [after] = await tx
      .update(companies)
      .set({ ...input, updatedAt: deps.now() })
      .where(eq(companies.id, actor.companyId))
      .returning();
    await recordAudit(tx, actor, 'company', actor.companyId, 'update', { name: before.name, currency: before.currency }, input);
    return { name: after.name, currency: after.currency };
  });
}

export async function listOutbox(deps: AppDeps, actor: Actor, limit = 200): Promise<OutboxMessage[]> {
  const rows = await deps.db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.companyId, actor.companyId))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(limit);
  return rows.map((r) => ({
    id: r.id,
    toAddress: r.toAddress,
    subject: r.subject,
    bodyText: r.bodyText,
    status: r.status,
    error: r.error,
    createdAt: r.createdAt.toISOString(),
  }));
}

export async function listAudit(deps: AppDeps, actor: Actor, limit = 200): Promise<AuditEntry[]> {
  const rows = await deps.db
    .select({ a: auditLog, email: users.email })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(eq(auditLog.companyId, actor.companyId))
    .orderBy(desc(auditLog.id))
    .limit(limit);
  return rows.map((r) => ({
    id: r.a.id,
    at: r.a.at.toISOString(),
    userEmail: r.email,
    entity: r.a.entity,
    entityId: r.a.entityId,
    action: r.a.action,
    before: r.a.before,
    after: r.a.after,
  }));
}
