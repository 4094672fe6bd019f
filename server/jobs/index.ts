/**
 * Background work on PostgreSQL (pg-boss): the monthly report e-mails and drift alerts on a schedule, and the
 * refit of a vessel's curves after a log import. Several server processes can run it on one database: pg-boss
 * hands each job to one worker, and every e-mail is guarded by its delivery row (subscriptions service).
 */
import PgBoss from 'pg-boss';
import type { AppDeps, JobQueue } from '../context';
import { listVesselCurves } from '../services/curves';
import { previousMonth } from '../services/reports';
import { deliverDriftAlerts, deliverMonthlyReports, systemActorOf } from '../services/subscriptions';
import { checkOverhaulAlerts } from '../services/overhaul-alerts';

export const QUEUES = {
  monthlyReports: 'monthly-reports',
  driftAlerts: 'drift-alerts',
  refitAfterImport: 'refit-after-import',
  overhaulAlerts: 'overhaul-alerts',
} as const;

/** 06:00 UTC on the first of each month: the reports of the month before. */
export const MONTHLY_REPORTS_CRON = '0 6 1 * *';
/** 07:00 UTC every day. */
export const DRIFT_ALERTS_CRON = '0 7 * * *';
/** Every hour at :15, so a set that nears its due is reported the same day. */
export const OVERHAUL_ALERTS_CRON = '15 * * * *';

export interface MonthlyReportsJob {
  /** YYYY-MM; default the month before the job runs. */
  month?: string;
}
export interface RefitJob {
  companyId: string;
  vesselId: string;
}

export interface Jobs extends JobQueue {
  boss: PgBoss;
  start(): Promise<void>;
  stop(): Promise<void>;
  /** Queues the monthly reports of a month now (what the schedule does on the first of the month). */
  triggerMonthlyReports(month?: string): Promise<string | null>;
}

export interface JobsOptions {
  /** Register the cron schedules (default true). */
  schedule?: boolean;
  /** Polling interval of the workers, s (pg-boss minimum 0.5; default 2). */
  pollingIntervalSeconds?: number;
  /** Called after each job with its queue and outcome (logging, tests). */
  onDone?: (queue: string, result: unknown) => void;
}

/**
 * The job queue of a server process on the database at `connectionString`. start() creates the queues, the
 * schedules and the workers; stop() waits for running jobs and closes pg-boss's pool.
 */
export function createJobs(deps: AppDeps, connectionString: string, options: JobsOptions = {}): Jobs {
  const boss = new PgBoss({ connectionString, max: 4 });
  boss.on('error', (err: Error) => console.error(`[jobs] ${err.message}`));
  const workOptions = { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2, batchSize: 1 };
  const done = options.onDone ?? (() => undefined);
  return {
    boss,
    async start() {
      await boss.start();
      for (const name of Object.values(QUEUES)) await boss.createQueue(name);
      if (options.schedule !== false) {
        await boss.schedule(QUEUES.monthlyReports, MONTHLY_REPORTS_CRON, {}, { tz: 'UTC' });
        await boss.schedule(QUEUES.driftAlerts, DRIFT_ALERTS_CRON, {}, { tz: 'UTC' });
        await boss.schedule(QUEUES.overhaulAlerts, OVERHAUL_ALERTS_CRON, {}, { tz: 'UTC' });
      }
      await boss.work<MonthlyReportsJob>(QUEUES.monthlyReports, workOptions, async ([job]) => {
        const month = job.data?.month ?? previousMonth(deps.now());
        done(QUEUES.monthlyReports, await deliverMonthlyReports(deps, month));
      });
      await boss.work(QUEUES.driftAlerts, workOptions, async () => {
        done(QUEUES.driftAlerts, await deliverDriftAlerts(deps, deps.now().toISOString().slice(0, 7)));
      });
      await boss.work(QUEUES.overhaulAlerts, workOptions, async () => {
        done(QUEUES.overhaulAlerts, await checkOverhaulAlerts(deps, deps.now()));
      });
      await boss.work<RefitJob>(QUEUES.refitAfterImport, workOptions, async ([job]) => {
        const actor = await systemActorOf(deps, job.data.companyId);
        if (!actor) return;
        // A read of the curves refits every set whose inputs changed and stores the new fits (curves service).
        const curves = await listVesselCurves(deps, actor, job.data.vesselId, { window: 'since_overhaul' });
        done(QUEUES.refitAfterImport, { refitted: curves.sets.filter((s) => s.refitted).length });
      });
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 10_000 });
    },
    async triggerMonthlyReports(month) {
      return boss.send(QUEUES.monthlyReports, month ? { month } : {});
    },
    async enqueueRefit(job) {
      await boss.send(QUEUES.refitAfterImport, job, { singletonKey: job.vesselId, singletonSeconds: 30 });
    },
  };
}
