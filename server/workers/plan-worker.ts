/**
 * Worker thread of a voyage plan: solves the stored inputs it is given and posts progress and the result.
 * Pure computation (services/plans-solve.ts); the main thread does every database write.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { solveStoredPlan, type StoredPlanInputs } from '../services/plans-solve';

export type PlanWorkerMessage =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; result: ReturnType<typeof solveStoredPlan>; solveMs: number }
  | { type: 'error'; message: string };

const port = parentPort!;
const { inputs } = workerData as { inputs: StoredPlanInputs };
const started = performance.now();
try {
  const result = solveStoredPlan(inputs, (fraction) => port.postMessage({ type: 'progress', fraction } satisfies PlanWorkerMessage));
  port.postMessage({ type: 'done', result, solveMs: performance.now() - started } satisfies PlanWorkerMessage);
} catch (e) {
  port.postMessage({ type: 'error', message: e instanceof Error ? e.message : String(e) } satisfies PlanWorkerMessage);
}
