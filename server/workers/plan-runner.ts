/**
 * Runs voyage plans in worker threads, one at a time (the solver is CPU-bound; the request thread stays free).
 */
import { Worker } from 'node:worker_threads';
import type { StoredPlanInputs } from '../services/plans-solve';
import type { PlanWorkerMessage } from './plan-worker';

export interface PlanRunHandlers {
  onStart(): Promise<void>;
  onProgress(fraction: number): void;
  onDone(result: Extract<PlanWorkerMessage, { type: 'done' }>): Promise<void>;
  onError(message: string): Promise<void>;
}

const BOOT = new URL('./boot.mjs', import.meta.url);
const ENTRY = new URL('./plan-worker.ts', import.meta.url).href;
/** Longest solve before the worker is stopped, ms. */
const SOLVE_LIMIT_MS = 10 * 60 * 1000;

let chain: Promise<void> = Promise.resolve();
const queued = new Set<string>();

/** True while the plan waits or solves in this process. */
export function isQueued(planId: string): boolean {
  return queued.has(planId);
}

function runOne(inputs: StoredPlanInputs, h: PlanRunHandlers): Promise<void> {
  return new Promise<void>((resolve) => {
    let settled = false;
    const worker = new Worker(BOOT, { workerData: { entry: ENTRY, inputs } });
    const finish = async (f: () => Promise<void>) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      try {
        await f();
      } finally {
        void worker.terminate();
        resolve();
      }
    };
    const timer = setTimeout(() => void finish(() => h.onError(`the solve took longer than ${SOLVE_LIMIT_MS / 60000} minutes`)), SOLVE_LIMIT_MS);
    worker.on('message', (m: PlanWorkerMessage) => {
      if (m.type === 'progress') h.onProgress(m.fraction);
      else if (m.type === 'done') void finish(() => h.onDone(m));
      else void finish(() => h.onError(m.message));
    });
    worker.on('error', (e) => void finish(() => h.onError(e.message)));
    worker.on('exit', (code) => void finish(() => h.onError(`the solver stopped (exit code ${code})`)));
  });
}

/** Queues one plan; handlers run on the main thread. Errors in handlers are logged, never thrown. */
export function enqueuePlan(planId: string, inputs: StoredPlanInputs, handlers: PlanRunHandlers): void {
  if (queued.has(planId)) return;
  queued.add(planId);
  chain = chain
    .then(async () => {
      await handlers.onStart();
      await runOne(inputs, handlers);
    })
    .catch((e: unknown) => console.error(`[plans] plan ${planId}:`, e))
    .finally(() => queued.delete(planId));
}
