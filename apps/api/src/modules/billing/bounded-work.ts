/**
 * Runs `work` over the items with at most `limit` in flight, started in their order. After a failure no new item is
 * started, and the failure is thrown only once every started item has settled: the caller's locks outlive the work.
 */
export async function eachBounded<T>(items: readonly T[], limit: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  let failure: { error: unknown } | null = null;
  const lane = async () => {
    while (!failure && next < items.length) {
      try {
        await work(items[next++]!);
      } catch (error) {
        failure ??= { error };
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, lane));
  if (failure) throw (failure as { error: unknown }).error;
}

/**
 * Serialises a write of changing state (a job's progress): one write at a time, calls made while one is running are
 * folded into a single follow-up that reads the state afresh, so no older figure lands after a newer one. A call
 * resolves once a write that started after it has finished.
 */
export function latestWins(write: () => Promise<void>): () => Promise<void> {
  let inFlight: Promise<void> | null = null;
  let dirty = false;
  return () => {
    if (inFlight) {
      dirty = true;
      return inFlight;
    }
    inFlight = (async () => {
      try {
        do {
          dirty = false;
          await write();
        } while (dirty);
      } finally {
        inFlight = null;
      }
    })();
    return inFlight;
  };
}
