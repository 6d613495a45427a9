import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { repoRoot } from './lib/paths';
import { bringUp, reportFailure } from './lib/stack';

/** Convenience: the same stack as `npm start`, with the API under `tsx watch` and the Vite dev server. */
async function main() {
  const apiPort = Number(process.env.API_PORT ?? 3001);
  const stack = await bringUp({
    name: 'app', pgPort: Number(process.env.FEMTOSLOT_PG_PORT ?? 54329), database: 'femtoslot', freshDatabase: false,
    smtpPort: Number(process.env.MAIL_SMTP_PORT ?? 1025), mailWebPort: Number(process.env.MAIL_WEB_PORT ?? 1080),
  });
  const bin = (name: string) => path.join(repoRoot, 'node_modules', '.bin', name);
  const children: ChildProcess[] = [
    spawn(bin('tsx'), ['watch', '--tsconfig', 'tsconfig.json', 'src/index.ts'], {
      cwd: path.join(repoRoot, 'apps', 'api'), stdio: 'inherit', detached: true,
      env: { ...process.env, PORT: String(apiPort), HOST: '127.0.0.1', APP_URL: 'http://127.0.0.1:5173', DATABASE_URL: stack.databaseUrl,
        DATA_DIR: stack.appDataDir, SMTP_PORT: String(stack.mail.smtpPort), LOG_LEVEL: process.env.LOG_LEVEL ?? 'info' },
    }),
    spawn(bin('vite'), [], { cwd: path.join(repoRoot, 'apps', 'web'), stdio: 'inherit', detached: true, env: { ...process.env, API_PORT: String(apiPort) } }),
  ];
  console.log(`\n  Web (Vite, hot reload): http://127.0.0.1:5173\n  API: http://127.0.0.1:${apiPort}\n  Mail capture: ${stack.mail.webUrl}\n`);
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    for (const c of children) { try { process.kill(-c.pid!, 'SIGTERM'); } catch { /* gone */ } }
    await new Promise((r) => setTimeout(r, 1500));
    await stack.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

main().catch((err) => { reportFailure(err); process.exit(1); });
