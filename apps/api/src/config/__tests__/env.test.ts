import { mkdtempSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadEnv } from '../env';

describe('configuration', () => {
  it('when required variables are missing, then start-up fails naming each one', () => {
    expect(() => loadEnv({})).toThrow(/DATABASE_URL[\s\S]*DATA_DIR|DATA_DIR[\s\S]*DATABASE_URL/);
  });

  it('when in production without JWT_SECRET, then start-up fails naming it', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    expect(() => loadEnv({ NODE_ENV: 'production', DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir })).toThrow(/JWT_SECRET: required in production/);
  });

  it('when in production without STRIPE_WEBHOOK_SECRET, then start-up fails naming it instead of using the public local value', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    const production = { NODE_ENV: 'production', DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir, JWT_SECRET: 'p'.repeat(48) };
    expect(() => loadEnv(production)).toThrow(/STRIPE_WEBHOOK_SECRET: required in production/);
    expect(loadEnv({ ...production, STRIPE_WEBHOOK_SECRET: 'whsec_real_one', STRIPE_SECRET_KEY: 'sk_live_real_one' }).STRIPE_WEBHOOK_SECRET).toBe('whsec_real_one');
  });

  it('when in production without STRIPE_SECRET_KEY, then start-up fails naming it instead of using the local test key', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    const production = { NODE_ENV: 'production', DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir, JWT_SECRET: 'p'.repeat(48), STRIPE_WEBHOOK_SECRET: 'whsec_real_one' };
    expect(() => loadEnv(production)).toThrow(/STRIPE_SECRET_KEY: required in production/);
    expect(loadEnv({ ...production, STRIPE_SECRET_KEY: 'sk_live_real_one' }).STRIPE_SECRET_KEY).toBe('sk_live_real_one');
    expect(loadEnv({ DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir }).STRIPE_SECRET_KEY).toBe('sk_test_femtoslot_local');
  });

  it('when in production without either secret, then start-up fails naming both', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    expect(() => loadEnv({ NODE_ENV: 'production', DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir })).toThrow(/JWT_SECRET: required in production\n\s+STRIPE_WEBHOOK_SECRET: required in production/);
  });

  it('when in development without STRIPE_WEBHOOK_SECRET, then the local fake\'s value is used', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    expect(loadEnv({ DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir }).STRIPE_WEBHOOK_SECRET).toBe('whsec_femtoslot_local');
  });

  it('when in development without JWT_SECRET, then one is generated once and kept in the data folder', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'fs-env-'));
    const first = loadEnv({ DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir });
    const second = loadEnv({ DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: dir });
    expect(first.JWT_SECRET.length).toBeGreaterThanOrEqual(32);
    expect(second.JWT_SECRET).toBe(first.JWT_SECRET);
    expect(readFileSync(path.join(dir, 'jwt-secret'), 'utf8')).toBe(first.JWT_SECRET);
  });

  it('when PORT is not a number, then the error names PORT', () => {
    expect(() => loadEnv({ DATABASE_URL: 'postgres://x@127.0.0.1/db', DATA_DIR: '/tmp', PORT: 'eighty' })).toThrow(/PORT/);
  });
});
