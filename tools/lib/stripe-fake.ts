import path from 'node:path';
import { mkdirSync } from 'node:fs';

export interface RunningStripeFake {
  port: number;
  url: string;
  stop(): Promise<void>;
}

/** The Stripe-compatible fake, in this process, on loopback; state kept in a file so `npm start` survives restarts. */
export async function startStripeFake(port: number, o: { webhookUrl?: string; webhookSecret?: string; stateDir?: string } = {}): Promise<RunningStripeFake> {
  const { createStripeFake } = await import('../../infra/local-fakes/stripe/create-stripe-fake');
  if (o.stateDir) mkdirSync(o.stateDir, { recursive: true });
  const fake = createStripeFake({
    webhookUrl: o.webhookUrl, webhookSecret: o.webhookSecret ?? 'whsec_femtoslot_local',
    stateFile: o.stateDir ? path.join(o.stateDir, 'stripe-fake-state.json') : undefined,
  });
  const server = await fake.listen(port, '127.0.0.1');
  let stopped = false;
  return { port: server.port, url: server.url, stop: async () => { if (stopped) return; stopped = true; await server.close().catch(() => undefined); } };
}
