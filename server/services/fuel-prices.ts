/**
 * The company's fuel prices per grade (per tonne, company currency), each valid from its date until the day before
 * the next price of the same grade. An admin sets them; savings and reports cost fuel with them.
 */
import { and, asc, eq } from 'drizzle-orm';
import { dateOfDayNumber, dayNumber, type FuelPrice } from '../../optimizer/index';
import type { FuelPriceInput, FuelPriceRow } from '../../shared/schemas/savings';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { fuelPrices } from '../db/schema';
import { notFound } from '../errors';
import { recordAudit } from './audit';

/** Every price of a company with its derived validity end, by grade then date. No access check: callers do it. */
export async function companyFuelPrices(db: DbOrTx, companyId: string, currency: string): Promise<FuelPriceRow[]> {
  const rows = await db.select().from(fuelPrices).where(eq(fuelPrices.companyId, companyId)).orderBy(asc(fuelPrices.grade), asc(fuelPrices.validFrom));
  return rows.map((r, i) => {
    const next = rows[i + 1];
    const validTo = next && next.grade === r.grade ? dateOfDayNumber(dayNumber(next.validFrom) - 1) : null;
    return { id: r.id, grade: r.grade, pricePerT: r.pricePerT, currency, validFrom: r.validFrom, validTo };
  });
}

/** The prices as the savings computation takes them. */
export function toOptimizerPrices(rows: FuelPriceRow[]): FuelPrice[] {
  return rows.map((r) => ({ grade: r.grade as FuelPrice['grade'], pricePerT: r.pricePerT, currency: r.currency, validFrom: r.validFrom, validTo: r.validTo }));
}

export async function listFuelPrices(deps: AppDeps, actor: Actor): Promise<FuelPriceRow[]> {
  return companyFuelPrices(deps.db, actor.companyId, actor.currency);
}

/** Sets the price of a grade from a date (replaces the price of that grade and date when there is one). */
export async function putFuelPrice(deps: AppDeps, actor: Actor, input: FuelPriceInput): Promise<FuelPriceRow[]> {
  await deps.db.transaction(async (tx) => {
    const [before] = await tx
      .select()
      .from(fuelPrices)
      .where(and(eq(fuelPrices.companyId, actor.companyId), eq(fuelPrices.grade, input.grade), eq(fuelPrices.validFrom, input.validFrom)));
    const [after] = await tx
      .insert(fuelPrices)
      .values({ companyId: actor.companyId, ...input })
      .onConflictDoUpdate({ target: [fuelPrices.companyId, fuelPrices.grade, fuelPrices.validFrom], set: { pricePerT: input.pricePerT } })
      .returning();
    await recordAudit(tx, actor, 'fuel_price', after.id, before ? 'update' : 'create', before ?? null, after);
  });
  return listFuelPrices(deps, actor);
}

export async function deleteFuelPrice(deps: AppDeps, actor: Actor, priceId: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const [row] = await tx.delete(fuelPrices).where(and(eq(fuelPrices.id, priceId), eq(fuelPrices.companyId, actor.companyId))).returning();
    if (!row) throw notFound('Fuel price');
    await recordAudit(tx, actor, 'fuel_price', row.id, 'delete', row, null);
  });
}
