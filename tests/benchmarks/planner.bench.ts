/**
 * Day-planner timings: runs packages/shared/bench/planner.bench.ts (fewer heuristic restarts, to keep the whole
 * bench short) and reads its table back.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { repoRoot, type Figure } from './support';

export async function benchPlanner(restarts = Number(process.env.PLANNER_BENCH_RESTARTS ?? 20)): Promise<{ figures: Figure[]; detail: string }> {
  const out = await new Promise<string>((resolve, reject) => {
    const child = spawn(path.join(repoRoot, 'node_modules', '.bin', 'tsx'), ['packages/shared/bench/planner.bench.ts'], {
      cwd: repoRoot, env: { ...process.env, PLANNER_BENCH_RESTARTS: String(restarts) }, stdio: ['ignore', 'pipe', 'inherit'],
    });
    let text = '';
    child.stdout.on('data', (d) => { text += d; });
    const timer = setTimeout(() => { child.kill('SIGKILL'); reject(new Error('planner bench took longer than 120 s')); }, 120_000);
    child.on('close', (code) => { clearTimeout(timer); if (code === 0) resolve(text); else reject(new Error(`planner bench exited with ${code}`)); });
  });
  const table = out.slice(out.lastIndexOf('  n median ms'));
  const figures: Figure[] = [];
  for (const line of table.split('\n').slice(1)) {
    const cols = line.trim().split(/\s+/);
    if (cols.length < 9 || !/^\d+$/.test(cols[0]!)) continue;
    figures.push({
      section: '4', name: `planDay, ${cols[0]} requests (median of 7)`, value: Number(cols[1]), unit: 'ms',
      note: `placed ${cols[2]}, changeover ${cols[3]} min, proven optimal: ${cols[4]}, gap vs best of ${restarts} restarts ${cols[7]} %`,
    });
  }
  if (figures.length === 0) throw new Error(`planner bench printed no table:\n${out.slice(-1000)}`);
  return { figures, detail: table.trimEnd() };
}
