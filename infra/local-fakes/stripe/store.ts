import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

export type Metadata = Record<string, string>;
export type InvoiceStatus = 'draft' | 'open' | 'paid' | 'void';

export interface CustomerRecord {
  id: string;
  created: number;
  name: string | null;
  email: string | null;
  description: string | null;
  phone: string | null;
  currency: string | null;
  invoice_prefix: string;
  next_invoice_sequence: number;
  metadata: Metadata;
  deleted?: boolean;
}

export interface InvoiceItemRecord {
  id: string;
  created: number;
  customer: string;
  invoice: string | null;
  /** Line item id the item shows up as once attached to an invoice. */
  line_id: string | null;
  amount: number;
  currency: string;
  description: string | null;
  quantity: number;
  unit_amount_decimal: string;
  period: { start: number; end: number };
  metadata: Metadata;
}

export interface InvoiceRecord {
  id: string;
  created: number;
  customer: string;
  currency: string;
  status: InvoiceStatus;
  collection_method: 'send_invoice' | 'charge_automatically';
  days_until_due: number | null;
  due_date: number | null;
  auto_advance: boolean;
  description: string | null;
  footer: string | null;
  metadata: Metadata;
  number: string | null;
  hosted_invoice_url: string | null;
  amount_paid: number;
  paid_out_of_band: boolean;
  attempt_count: number;
  status_transitions: {
    finalized_at: number | null;
    marked_uncollectible_at: number | null;
    paid_at: number | null;
    voided_at: number | null;
  };
}

export interface EventRecord {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface IdempotencyRecord {
  fingerprint: string;
  status: number;
  body: unknown;
  requestId: string;
  createdAt: number;
}

export interface DeliveryAttempt {
  event: string;
  type: string;
  invoice: string | null;
  attempt: number;
  url: string;
  at: number;
  status: number | null;
  error: string | null;
  ok: boolean;
}

export interface FakeState {
  version: 1;
  customers: Record<string, CustomerRecord>;
  invoiceItems: Record<string, InvoiceItemRecord>;
  invoices: Record<string, InvoiceRecord>;
  events: Record<string, EventRecord>;
  /** Keyed by `${apiKey}\n${idempotencyKey}`: Stripe scopes keys to the account's API key. */
  idempotency: Record<string, IdempotencyRecord>;
  deliveries: DeliveryAttempt[];
}

export function emptyState(): FakeState {
  return { version: 1, customers: {}, invoiceItems: {}, invoices: {}, events: {}, idempotency: {}, deliveries: [] };
}

const BASE62 = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

export function newId(prefix: string, length = 14): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const byte of bytes) out += BASE62[byte % 62];
  return `${prefix}_${out}`;
}

export function newInvoicePrefix(): string {
  return randomBytes(4).toString('hex').toUpperCase();
}

export function nowSeconds(): number {
  return Math.floor(Date.now() / 1000);
}

export class FakeStore {
  data: FakeState;
  private readonly listeners = new Set<() => void>();

  constructor(private readonly stateFile?: string) {
    this.data = stateFile ? loadStateFile(stateFile) : emptyState();
  }

  /** Call after every mutation; persists synchronously so a crash right after a 200 never loses it. */
  changed(): void {
    if (this.stateFile) writeStateFile(this.stateFile, this.data);
    for (const listener of this.listeners) listener();
  }

  onChange(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  reset(): void {
    this.data = emptyState();
    this.changed();
  }

  dump(): FakeState {
    return structuredClone(this.data);
  }
}

function loadStateFile(path: string): FakeState {
  if (!existsSync(path)) return emptyState();
  let parsed: unknown;
  try {
    parsed = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    throw new Error(`stripe fake: state file ${path} is not valid JSON (${(error as Error).message}); delete it or fix it`);
  }
  const state = parsed as Partial<FakeState>;
  if (state.version !== 1) {
    throw new Error(`stripe fake: state file ${path} has version ${String(state.version)}, expected 1`);
  }
  return { ...emptyState(), ...state } as FakeState;
}

function writeStateFile(path: string, state: FakeState): void {
  mkdirSync(dirname(path), { recursive: true });
  const temporary = `${path}.${process.pid}.tmp`;
  writeFileSync(temporary, JSON.stringify(state));
  // rename is atomic on one filesystem: a reader never sees half a file
  renameSync(temporary, path);
}
