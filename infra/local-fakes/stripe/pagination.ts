import { resourceMissing } from './stripe-error';

export interface ListQuery {
  limit?: number;
  starting_after?: string;
  ending_before?: string;
}

/**
 * Cursor pagination as in Stripe's API reference ("Pagination"): newest first, `starting_after` pages
 * towards older objects, `ending_before` towards newer ones, at most `limit` (default 10) per page.
 * `records` arrive oldest first (insertion order).
 */
export function paginate<T extends { id: string }, R>(
  records: T[],
  query: ListQuery,
  url: string,
  render: (record: T) => R,
): { object: 'list'; data: R[]; has_more: boolean; url: string } {
  const newestFirst = [...records].reverse();
  const limit = query.limit ?? 10;
  let page: T[];
  let hasMore: boolean;
  if (query.starting_after) {
    const index = indexOf(newestFirst, query.starting_after, 'starting_after');
    const rest = newestFirst.slice(index + 1);
    page = rest.slice(0, limit);
    hasMore = rest.length > limit;
  } else if (query.ending_before) {
    const index = indexOf(newestFirst, query.ending_before, 'ending_before');
    const before = newestFirst.slice(0, index);
    page = before.slice(Math.max(before.length - limit, 0));
    hasMore = before.length > limit;
  } else {
    page = newestFirst.slice(0, limit);
    hasMore = newestFirst.length > limit;
  }
  return { object: 'list', data: page.map(render), has_more: hasMore, url };
}

function indexOf<T extends { id: string }>(records: T[], id: string, param: string): number {
  const index = records.findIndex((record) => record.id === id);
  if (index < 0) throw resourceMissing('object', id, param);
  return index;
}
