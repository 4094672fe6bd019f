import { spawn, type SpawnOptions } from 'node:child_process';
import path from 'node:path';
import { ROOT } from './bootstrap';

/** Runs a project binary from node_modules/.bin and resolves with its exit code. */
export function runBin(bin: string, args: string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(ROOT, 'node_modules', '.bin', bin), args, { cwd: ROOT, stdio: 'inherit', ...options });
    child.once('error', reject);
    child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

export async function buildClient(): Promise<void> {
  console.log('[build] building the client (vite build)');
  const code = await runBin('vite', ['build', '--logLevel', 'warn']);
  if (code !== 0) throw new Error(`vite build failed with exit ${code}`);
}
