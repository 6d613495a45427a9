import { describe, expect, it } from 'vitest';
import { eachBounded, latestWins } from '../bounded-work';

const tick = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('bounded work for the close job', () => {
  it('when ten items run with a limit of three, then never more than three are in flight, each runs once, and they start in order', async () => {
    let inFlight = 0;
    let most = 0;
    const started: number[] = [];
    await eachBounded([...Array(10).keys()], 3, async (i) => {
      started.push(i);
      inFlight++;
      most = Math.max(most, inFlight);
      await tick(5 + ((i * 7) % 11));
      inFlight--;
    });
    expect(started).toEqual([...Array(10).keys()]);
    expect(most).toBe(3);
    expect(inFlight).toBe(0);
  });

  it('when an item fails, then no further item starts and the failure is thrown only after the items already started have finished', async () => {
    const finished: number[] = [];
    const started: number[] = [];
    const run = eachBounded([0, 1, 2, 3, 4, 5, 6, 7], 3, async (i) => {
      started.push(i);
      if (i === 1) {
        await tick(2);
        throw new Error('Stripe down');
      }
      await tick(20);
      finished.push(i);
    });
    await expect(run).rejects.toThrow('Stripe down');
    // 0 and 2 were running when 1 failed; nothing after them was started, and both had finished by the rejection.
    expect(started).toEqual([0, 1, 2]);
    expect(finished.sort()).toEqual([0, 2]);
  });

  it('when progress is reported while a write is running, then writes never overlap and the last write carries the latest figure', async () => {
    let done = 0;
    let writing = 0;
    let overlapped = false;
    const written: number[] = [];
    const report = latestWins(async () => {
      writing++;
      if (writing > 1) overlapped = true;
      const seen = done;
      await tick(10);
      written.push(seen);
      writing--;
    });
    const calls: Promise<void>[] = [];
    for (let i = 0; i < 6; i++) {
      done++;
      calls.push(report());
      await tick(3);
    }
    await Promise.all(calls);
    expect(overlapped).toBe(false);
    expect(written.at(-1)).toBe(6);
    // Folded: fewer writes than reports, and the figures written only ever go up.
    expect(written.length).toBeLessThan(6);
    expect([...written].sort((a, b) => a - b)).toEqual(written);
  });
});
