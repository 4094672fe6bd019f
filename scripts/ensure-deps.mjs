// Runs before node_modules exists, so it is plain JavaScript with no dependencies (everything else is TypeScript).
// Installs exactly what package-lock.json pins when node_modules is missing or older than the lock file.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const lock = path.join(root, 'package-lock.json');
const marker = path.join(root, 'node_modules', '.package-lock.json');
const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync(lock).mtimeMs;
if (stale) {
  console.log('[setup] installing dependencies from package-lock.json (npm ci)');
  const res = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (res.status !== 0) {
    console.error('[setup] npm ci failed; see the messages above');
    process.exit(res.status ?? 1);
  }
}
