import type { Actor } from '../context';
import type { DbOrTx } from '../db/client';
import { auditLog } from '../db/schema';

/** Records one change: who, when (database time), what, before and after. Call inside the change's transaction. */
export async function recordAudit(
  db: DbOrTx,
  actor: Pick<Actor, 'companyId' | 'userId'> | { companyId: string; userId: string | null },
  entity: string,
  entityId: string,
  action: 'create' | 'update' | 'delete' | string,
  before: unknown,
  after: unknown,
): Promise<void> {
  await db.insert(auditLog).values({
    companyId: actor.companyId,
    userId: actor.userId,
    entity,
    entityId,
    action,
    before: before === undefined ? null : before,
    after: after === undefined ? null : after,
  });
}
