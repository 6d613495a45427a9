import { createHmac } from 'node:crypto';
import { type EventRecord, type FakeStore, newId, nowSeconds } from './store';

export interface WebhookOptions {
  url?: string;
  secret: string;
  /** Event types sent to the endpoint, like a Stripe webhook endpoint's `enabled_events`. */
  enabledEvents: string[];
  maxAttempts: number;
  initialDelayMs: number;
  maxDelayMs: number;
  timeoutMs: number;
}

export const defaultWebhookOptions: WebhookOptions = {
  secret: 'whsec_femtoslot_local',
  enabledEvents: ['invoice.finalized', 'invoice.sent', 'invoice.paid', 'invoice.voided'],
  maxAttempts: 5,
  initialDelayMs: 1_000,
  maxDelayMs: 30_000,
  timeoutMs: 10_000,
};

/**
 * The `Stripe-Signature` header: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<raw body>" keyed by the
 * endpoint secret>` (Stripe docs, "Check the webhook signatures" / "Verify manually"), which is what
 * stripe-node's `webhooks.constructEvent` recomputes.
 */
export function signatureHeader(payload: string, secret: string, timestamp = nowSeconds()): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export interface EventRequest {
  id: string | null;
  idempotencyKey: string | null;
  apiVersion: string;
}

export class WebhookDispatcher {
  private readonly chains = new Map<string, Promise<void>>();
  private inFlight = 0;
  private idleWaiters: Array<() => void> = [];
  private generation = 0;
  private readonly sleepers = new Set<{ timer: NodeJS.Timeout; resolve: () => void }>();

  constructor(
    private readonly store: FakeStore,
    readonly options: WebhookOptions,
  ) {}

  /** Records an event (visible at /v1/events) and queues it for the endpoint if it subscribes to the type. */
  emit(type: string, object: Record<string, unknown>, request: EventRequest): EventRecord {
    const delivered = this.subscribes(type);
    const event: EventRecord = {
      id: newId('evt', 24),
      object: 'event',
      api_version: request.apiVersion,
      created: nowSeconds(),
      data: { object },
      livemode: false,
      pending_webhooks: delivered ? 1 : 0,
      request: { id: request.id, idempotency_key: request.idempotencyKey },
      type,
    };
    this.store.data.events[event.id] = event;
    this.store.changed();
    if (delivered) this.enqueue(event);
    return event;
  }

  /** After a restart from a state file, events that never reached the endpoint go out again. */
  resumePending(): void {
    for (const event of Object.values(this.store.data.events)) {
      if (event.pending_webhooks > 0 && this.subscribes(event.type)) this.enqueue(event);
    }
  }

  idle(): Promise<void> {
    if (this.inFlight === 0) return Promise.resolve();
    return new Promise((resolve) => this.idleWaiters.push(resolve));
  }

  /** Abandons queued and sleeping deliveries (reset, close). */
  cancelAll(): void {
    this.generation += 1;
    for (const sleeper of this.sleepers) {
      clearTimeout(sleeper.timer);
      sleeper.resolve();
    }
    this.sleepers.clear();
  }

  private subscribes(type: string): boolean {
    if (!this.options.url) return false;
    return this.options.enabledEvents.includes('*') || this.options.enabledEvents.includes(type);
  }

  // Stripe itself does not promise ordering; Femtoslot's tests want it, so events of one invoice go one after another.
  private enqueue(event: EventRecord): void {
    const key = String(event.data.object.id ?? event.id);
    const generation = this.generation;
    this.inFlight += 1;
    const previous = this.chains.get(key) ?? Promise.resolve();
    const next = previous
      .then(() => (generation === this.generation ? this.deliver(event, generation) : undefined))
      .catch((error: unknown) => console.error('stripe fake: webhook delivery crashed', error))
      .finally(() => {
        if (this.chains.get(key) === next) this.chains.delete(key);
        this.inFlight -= 1;
        if (this.inFlight === 0) {
          const waiters = this.idleWaiters;
          this.idleWaiters = [];
          for (const resolve of waiters) resolve();
        }
      });
    this.chains.set(key, next);
  }

  private async deliver(event: EventRecord, generation: number): Promise<void> {
    const url = this.options.url;
    if (!url) return;
    const payload = JSON.stringify(event, null, 2);
    for (let attempt = 1; attempt <= this.options.maxAttempts; attempt += 1) {
      if (generation !== this.generation) return;
      const outcome = await this.attempt(url, payload);
      if (generation !== this.generation) return;
      this.store.data.deliveries.push({
        event: event.id,
        type: event.type,
        invoice: typeof event.data.object.id === 'string' ? event.data.object.id : null,
        attempt,
        url,
        at: Date.now(),
        ...outcome,
      });
      if (outcome.ok) {
        const stored = this.store.data.events[event.id];
        if (stored) stored.pending_webhooks = 0;
        this.store.changed();
        return;
      }
      this.store.changed();
      if (attempt < this.options.maxAttempts) await this.sleep(this.backoff(attempt));
    }
  }

  private async attempt(url: string, payload: string): Promise<{ ok: boolean; status: number | null; error: string | null }> {
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'User-Agent': 'Femtoslot-LocalStripeFake/1.0',
          // a fresh timestamp per attempt, as a retried Stripe delivery is signed anew
          'Stripe-Signature': signatureHeader(payload, this.options.secret),
        },
        body: payload,
        signal: AbortSignal.timeout(this.options.timeoutMs),
      });
      await response.arrayBuffer().catch(() => undefined);
      return { ok: response.ok, status: response.status, error: null };
    } catch (error) {
      const cause = (error as { cause?: { code?: string } }).cause;
      return { ok: false, status: null, error: cause?.code ?? (error as Error).name ?? 'fetch failed' };
    }
  }

  private backoff(attempt: number): number {
    return Math.min(this.options.initialDelayMs * 2 ** (attempt - 1), this.options.maxDelayMs);
  }

  private sleep(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const sleeper = {
        timer: setTimeout(() => {
          this.sleepers.delete(sleeper);
          resolve();
        }, ms),
        resolve,
      };
      this.sleepers.add(sleeper);
    });
  }
}
