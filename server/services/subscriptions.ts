/**
 * E-mail subscriptions of a user (monthly vessel/fleet reports, drift alerts, overhaul alerts) and their delivery.
 * A delivery row (UNIQUE subscription, delivery key) is inserted in the same transaction that sends the e-mail, so
 * a period or an alert is sent once even when several job workers or server processes handle it at the same time.
 */
import { and, desc, eq, inArray, isNull, max } from 'drizzle-orm';
import { can } from '../../shared/roles';
import { SUBSCRIPTION_LABELS, type SubscriptionInput, type SubscriptionKind, type SubscriptionRow } from '../../shared/schemas/reports';
import { subscriptionInputSchema } from '../../shared/schemas/reports';
import type { Actor, AppDeps } from '../context';
import { deliveries, memberships, subscriptions, vessels } from '../db/schema';
import { forbidden, notFound } from '../errors';
import { parseBody } from '../lib/parse';
import { inScope, vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadActor } from './auth';
import { getFleetDriftAlerts, getVesselDriftAlerts } from './curves';
import { buildFleetReport, buildVesselReport, reportFileName, reportXlsx } from './reports';

const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

export async function listSubscriptions(deps: AppDeps, actor: Actor): Promise<SubscriptionRow[]> {
  const rows = await deps.db
    .select({ s: subscriptions, vesselName: vessels.name })
    .from(subscriptions)
    .leftJoin(vessels, eq(vessels.id, subscriptions.vesselId))
    .where(and(eq(subscriptions.companyId, actor.companyId), eq(subscriptions.userId, actor.userId)))
    .orderBy(desc(subscriptions.createdAt));
  const ids = rows.map((r) => r.s.id);
  const last = ids.length
    ? await deps.db.select({ id: deliveries.subscriptionId, at: max(deliveries.sentAt) }).from(deliveries).where(inArray(deliveries.subscriptionId, ids)).groupBy(deliveries.subscriptionId)
    : [];
  const lastBy = new Map(last.map((l) => [l.id, l.at]));
  return rows.map(({ s, vesselName }) => {
    const at = lastBy.get(s.id);
    return {
      id: s.id,
      kind: s.kind,
      vesselId: s.vesselId,
      vesselName: vesselName ?? null,
      hoursBefore: s.hoursBefore,
      createdAt: s.createdAt.toISOString(),
      lastDeliveredAt: at ? new Date(at as unknown as string).toISOString() : null,
    };
  });
}

/** Subscribes the actor; the fleet report needs 'reports:read', a vessel must be in the actor's scope. */
export async function createSubscription(deps: AppDeps, actor: Actor, raw: SubscriptionInput): Promise<SubscriptionRow[]> {
  const input = parseBody(subscriptionInputSchema, raw, 'subscription');
  if (input.kind === 'fleet_monthly_report' && !can(actor.role, 'reports:read')) throw forbidden('Your role does not receive the fleet report');
  await deps.db.transaction(async (tx) => {
    if (input.vesselId) await vesselForActor(tx, actor, input.vesselId);
    const [same] = await tx
      .select()
      .from(subscriptions)
      .where(
        and(
          eq(subscriptions.userId, actor.userId),
          eq(subscriptions.companyId, actor.companyId),
          eq(subscriptions.kind, input.kind),
          input.vesselId ? eq(subscriptions.vesselId, input.vesselId) : isNull(subscriptions.vesselId),
        ),
      );
    if (same) {
      if (same.hoursBefore !== input.hoursBefore) {
        const [after] = await tx.update(subscriptions).set({ hoursBefore: input.hoursBefore }).where(eq(subscriptions.id, same.id)).returning();
        await recordAudit(tx, actor, 'subscription', same.id, 'update', same, after);
      }
      return;
    }
    const [row] = await tx.insert(subscriptions).values({ companyId: actor.companyId, userId: actor.userId, ...input }).returning();
    await recordAudit(tx, actor, 'subscription', row.id, 'create', null, row);
  });
  return listSubscriptions(deps, actor);
}

export async function deleteSubscription(deps: AppDeps, actor: Actor, id: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const [row] = await tx
      .delete(subscriptions)
      .where(and(eq(subscriptions.id, id), eq(subscriptions.userId, actor.userId), eq(subscriptions.companyId, actor.companyId)))
      .returning();
    if (!row) throw notFound('Subscription');
    await recordAudit(tx, actor, 'subscription', row.id, 'delete', row, null);
  });
}

/** The member behind a subscription, as a request would see them (role and scope read fresh); null when gone. */
async function actorOfSubscriber(deps: AppDeps, userId: string, companyId: string): Promise<Actor | null> {
  return loadActor(deps, { userId, companyId, sessionId: 'job', expiresAt: deps.now() });
}

/**
 * Sends a mail once per (subscription, key): inserts the delivery row and sends inside one transaction; a second
 * worker waits on the unique index and then finds the row. Returns true when this call sent it.
 */
async function sendOnce(deps: AppDeps, subscriptionId: string, key: string, mail: Parameters<AppDeps['mailer']['send']>[1]): Promise<boolean> {
  return deps.db.transaction(async (tx) => {
    const inserted = await tx
      .insert(deliveries)
      .values({ subscriptionId, deliveryKey: key, sentAt: deps.now() })
      .onConflictDoNothing({ target: [deliveries.subscriptionId, deliveries.deliveryKey] })
      .returning({ id: deliveries.id });
    if (!inserted.length) return false;
    await deps.mailer.send(tx, mail);
    return true;
  });
}

function originOf(deps: AppDeps): string {
  return (deps.config.appOrigin ?? 'http://localhost:5173').replace(/\/$/, '');
}

export interface DeliveryCount {
  sent: number;
  alreadySent: number;
  skipped: number;
}

/** Sends the monthly reports of `month` (YYYY-MM) to every subscriber, each once, XLSX attached with a link back. */
export async function deliverMonthlyReports(deps: AppDeps, month: string): Promise<DeliveryCount> {
  const subs = await deps.db.select().from(subscriptions).where(inArray(subscriptions.kind, ['vessel_monthly_report', 'fleet_monthly_report'] as SubscriptionKind[]));
  const count: DeliveryCount = { sent: 0, alreadySent: 0, skipped: 0 };
  for (const s of subs) {
    const [done] = await deps.db.select({ id: deliveries.id }).from(deliveries).where(and(eq(deliveries.subscriptionId, s.id), eq(deliveries.deliveryKey, month)));
    if (done) {
      count.alreadySent++;
      continue;
    }
    const actor = await actorOfSubscriber(deps, s.userId, s.companyId);
    if (!actor || (s.kind === 'fleet_monthly_report' && !can(actor.role, 'reports:read')) || (s.vesselId && !inScope(actor, s.vesselId))) {
      count.skipped++;
      continue;
    }
    const report = s.kind === 'fleet_monthly_report' ? await buildFleetReport(deps, actor, month) : await buildVesselReport(deps, actor, s.vesselId as string, month);
    const link = s.kind === 'fleet_monthly_report' ? `${originOf(deps)}/fleet/report?month=${month}` : `${originOf(deps)}/vessels/${s.vesselId}/report?month=${month}`;
    const text = [
      `${report.title}`,
      '',
      ...report.summary.map((x) => `${x.label}: ${x.value}`),
      '',
      `The full report is attached (XLSX) and online: ${link}`,
      '',
      report.caution,
      '',
      `You receive this because you subscribed to "${SUBSCRIPTION_LABELS[s.kind]}". Unsubscribe under ${originOf(deps)}/subscriptions.`,
    ].join('\n');
    const sent = await sendOnce(deps, s.id, month, {
      companyId: s.companyId,
      to: actor.email,
      subject: `Kilowatch: ${report.title}`,
      text,
      attachments: [{ filename: reportFileName(report, 'xlsx'), content: await reportXlsx(report), contentType: XLSX_TYPE }],
    });
    if (sent) count.sent++;
    else count.alreadySent++;
  }
  return count;
}

/** Sends each drift alert once per set and month to the subscribers of drift alerts. */
export async function deliverDriftAlerts(deps: AppDeps, month: string): Promise<DeliveryCount> {
  const subs = await deps.db.select().from(subscriptions).where(eq(subscriptions.kind, 'drift_alert'));
  const count: DeliveryCount = { sent: 0, alreadySent: 0, skipped: 0 };
  for (const s of subs) {
    const actor = await actorOfSubscriber(deps, s.userId, s.companyId);
    if (!actor || (s.vesselId && !inScope(actor, s.vesselId))) {
      count.skipped++;
      continue;
    }
    const fleet = s.vesselId ? { vessels: [await getVesselDriftAlerts(deps, actor, s.vesselId)] } : await getFleetDriftAlerts(deps, actor);
    for (const v of fleet.vessels) {
      for (const set of v.sets.filter((x) => x.alert)) {
        const sent = await sendOnce(deps, s.id, `drift:${set.gensetId}:${month}`, {
          companyId: s.companyId,
          to: actor.email,
          subject: `Kilowatch: SFOC drift alert on ${v.vesselName} ${set.designation}`,
          text: [
            `${v.vesselName} ${set.designation}: SFOC since the last overhaul is ${set.excessGPerKwh?.toFixed(1) ?? '?'} g/kWh above its baseline`,
            `(lower bound ${set.excessLowerBoundGPerKwh?.toFixed(1) ?? '?'} g/kWh at ${Math.round(set.confidence * 100)} % confidence; threshold ${set.thresholdGPerKwh?.toFixed(1) ?? '?'} g/kWh).`,
            '',
            `Curves: ${originOf(deps)}/vessels/${v.vesselId}/curves`,
          ].join('\n'),
        });
        if (sent) count.sent++;
        else count.alreadySent++;
      }
    }
  }
  return count;
}

/** Members of a company who may act for background work (an admin first), for jobs that need an actor. */
export async function systemActorOf(deps: AppDeps, companyId: string): Promise<Actor | null> {
  const rows = await deps.db.select().from(memberships).where(eq(memberships.companyId, companyId));
  const pick = rows.find((m) => m.role === 'admin') ?? rows.find((m) => !m.vesselScoped);
  return pick ? actorOfSubscriber(deps, pick.userId, companyId) : null;
}
