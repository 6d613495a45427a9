import { createHash } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const key = createHash('sha256').update(repoRoot).digest('hex').slice(0, 12);

/**
 * Data lives outside git, in a folder keyed by the checkout path under the system's var-temp area, because
 * PostgreSQL (run as the postgres user when we are root) must be able to traverse every parent folder.
 */
export const dataRoot = process.env.FEMTOSLOT_DATA_DIR ?? path.join('/var/tmp', `femtoslot-${key}`);
/** Unix socket paths have a length limit of about 100 bytes, so sockets go in a short folder. */
export const socketDir = path.join(os.tmpdir(), `fs-${key}`);
export const artifactsDir = path.join(repoRoot, 'artifacts');
export const webDist = path.join(repoRoot, 'apps', 'web', 'dist');
