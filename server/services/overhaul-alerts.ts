/**
 * Overhaul-due alerts: every subscriber of kind 'overhaul_alert' gets one e-mail per due (set, kind, due point)
 * when the set comes within the subscription's hoursBefore of it. The delivery row (UNIQUE subscription, key) is
 * inserted in the transaction that sends the mail, so a due is mailed once however often the check runs.
 */
import { and, eq } from 'drizzle-orm';
import { dueAlerts, dueKey } from '../../optimizer/overhaul/alerts';
import type { AlertCheckResult } from '../../shared/schemas/overhaul';
import type { Actor, AppDeps } from '../context';
import { deliveries, subscriptions, vessels } from '../db/schema';
import { inScope } from './access';
import { loadActor } from './auth';
import { loadSetHours } from './overhaul-data';

const KEY_PREFIX = 'genset:';

/** The delivery key of a due: 'genset:<id>:<kind>:<due point on the continuous hour scale, 0.1 h>'. */
export function overhaulDeliveryKey(due: { gensetId: string; kind: string; dueAtEquivalentH: number }): string {
  return `${KEY_PREFIX}${dueKey(due)}`;
}

function originOf(deps: AppDeps): string {
  return (deps.config.appOrigin ?? 'http://localhost:5173').replace(/\/$/, '');
}

/**
 * Checks every overhaul-alert subscription and mails the dues that came within its hours. `now` is the time the
 * delivery rows carry; `companyId` limits the check to one company. Returns what was sent, what had been sent before and the subscriptions skipped (member gone,
 * vessel out of scope).
 */
export async function checkOverhaulAlerts(deps: AppDeps, now: Date, options: { companyId?: string } = {}): Promise<AlertCheckResult> {
  const kind = eq(subscriptions.kind, 'overhaul_alert');
  const subs = await deps.db.select().from(subscriptions).where(options.companyId ? and(kind, eq(subscriptions.companyId, options.companyId)) : kind);
  const count: AlertCheckResult = { sent: 0, alreadySent: 0, skipped: 0 };
  for (const s of subs) {
    const actor: Actor | null = await loadActor(deps, { userId: s.userId, companyId: s.companyId, sessionId: 'job', expiresAt: now });
    if (!actor || (s.vesselId && !inScope(actor, s.vesselId))) {
      count.skipped++;
      continue;
    }
    const list = await deps.db
      .select({ id: vessels.id, name: vessels.name })
      .from(vessels)
      .where(s.vesselId ? and(eq(vessels.companyId, s.companyId), eq(vessels.id, s.vesselId)) : eq(vessels.companyId, s.companyId));
    const sent = new Set(
      (await deps.db.select({ key: deliveries.deliveryKey }).from(deliveries).where(eq(deliveries.subscriptionId, s.id))).map((d) => d.key.slice(KEY_PREFIX.length)),
    );
    for (const v of list.filter((x) => inScope(actor, x.id))) {
      const sets = await loadSetHours(deps.db, v.id);
      const names = new Map(sets.map((x) => [x.id, x.designation]));
      const statuses = sets.flatMap((x) => x.statuses);
      const alerts = dueAlerts(statuses, s.hoursBefore ?? 0, sent);
      count.alreadySent += statuses.filter((x) => x.hoursLeft <= (s.hoursBefore ?? 0) && sent.has(dueKey(x))).length;
      for (const a of alerts) {
        const designation = names.get(a.gensetId) ?? 'set';
        const mailed = await deps.db.transaction(async (tx) => {
          const inserted = await tx
            .insert(deliveries)
            .values({ subscriptionId: s.id, deliveryKey: overhaulDeliveryKey(a), sentAt: now })
            .onConflictDoNothing({ target: [deliveries.subscriptionId, deliveries.deliveryKey] })
            .returning({ id: deliveries.id });
          if (!inserted.length) return false;
          const left = Math.round(a.hoursLeft * 10) / 10;
          await deps.mailer.send(tx, {
            companyId: s.companyId,
            to: actor.email,
            subject: `Kilowatch: ${a.kind} of ${v.name} ${designation} ${a.overdue ? 'is overdue' : `due in ${left} running hours`}`,
            text: [
              `${v.name} ${designation}: ${a.kind} ${a.overdue ? `is overdue by ${-left} h` : `falls due in ${left} running hours`},`,
              `at ${Math.round(a.dueAtMeterReadingH * 10) / 10} h on the hour meter fitted now.`,
              '',
              `Planner: ${originOf(deps)}/vessels/${v.id}/overhaul`,
              '',
              'Kilowatch advises; the maker’s maintenance instructions, class rules and the chief engineer decide when the work is done.',
              '',
              `You receive this because you subscribed to overhaul-due alerts (within ${s.hoursBefore ?? 0} h). Unsubscribe under ${originOf(deps)}/subscriptions.`,
            ].join('\n'),
          });
          return true;
        });
        if (mailed) count.sent++;
        else count.alreadySent++;
      }
    }
  }
  return count;
}

