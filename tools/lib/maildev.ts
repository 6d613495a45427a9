import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { repoRoot } from './paths';
import { waitFor } from './step';

export interface MailCapture {
  smtpPort: number;
  webPort: number;
  webUrl: string;
  stop(): Promise<void>;
}

export async function startMailCapture(smtpPort: number, webPort: number, mailDir: string): Promise<MailCapture> {
  mkdirSync(mailDir, { recursive: true });
  const bin = path.join(repoRoot, 'node_modules', '.bin', 'maildev');
  const child: ChildProcess = spawn(bin, ['--smtp', String(smtpPort), '--ip', '127.0.0.1', '--web', String(webPort), '--web-ip', '127.0.0.1', '--mail-directory', mailDir], {
    detached: true,
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (d) => { stderr += d; });
  const webUrl = `http://127.0.0.1:${webPort}`;
  let exited = false;
  child.on('exit', () => { exited = true; });
  await waitFor(`mail capture on ${webUrl}`, async () => {
    if (exited) throw new Error(`maildev exited: ${stderr.slice(-500)}`);
    const r = await fetch(`${webUrl}/api/healthz`);
    return r.ok;
  }, 20_000).catch((err) => {
    try { process.kill(-child.pid!, 'SIGKILL'); } catch { /* already gone */ }
    throw err;
  });
  return {
    smtpPort,
    webPort,
    webUrl,
    stop: async () => {
      if (exited) return;
      try { process.kill(-child.pid!, 'SIGTERM'); } catch { return; }
      await waitFor('mail capture to stop', async () => exited, 5000).catch(() => {
        try { process.kill(-child.pid!, 'SIGKILL'); } catch { /* gone */ }
      });
    },
  };
}
