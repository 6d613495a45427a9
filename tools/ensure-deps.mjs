// Plain JavaScript on purpose: it runs before TypeScript tooling is installed.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const lock = path.join(root, 'package-lock.json');
const stamp = path.join(root, 'node_modules', '.femtoslot-lock-hash');
const hash = createHash('sha256').update(readFileSync(lock)).digest('hex');
const started = Date.now();

if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === hash && existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) {
  console.log(`[femtoslot] npm dependencies up to date (${Date.now() - started} ms)`);
} else {
  console.log('[femtoslot] installing npm dependencies (npm ci) …');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: root, stdio: 'inherit', timeout: 15 * 60_000 });
  if (r.status !== 0) {
    console.error('[femtoslot] npm ci failed. Check the network to the npm registry, then run `npm ci` in ' + root);
    process.exit(1);
  }
  writeFileSync(stamp, hash);
  console.log(`[femtoslot] npm dependencies installed (${((Date.now() - started) / 1000).toFixed(1)} s)`);
}
