import { and, eq } from 'drizzle-orm';
import type { Actor } from '../context';
import type { DbOrTx } from '../db/client';
import { vessels } from '../db/schema';
import { notFound } from '../errors';

/** True when the actor may see the vessel at all (same company, and in scope for a vessel-scoped member). */
export function inScope(actor: Actor, vesselId: string): boolean {
  return actor.vesselIds === null || actor.vesselIds.includes(vesselId);
}

/**
 * The vessel row when it belongs to the actor's company and is in the actor's scope; else 404 (a vessel of another
 * company is never confirmed to exist).
 */
export async function vesselForActor(db: DbOrTx, actor: Actor, vesselId: string) {
  const [vessel] = await db.select().from(vessels).where(and(eq(vessels.id, vesselId), eq(vessels.companyId, actor.companyId)));
  if (!vessel || !inScope(actor, vessel.id)) throw notFound('Vessel');
  return vessel;
}
