import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { DEFAULT_PAGE_SIZE } from '../../shared/schemas/common';

/**
 * A list's page, sort, text search and filters, kept in the address bar so a
 * filtered list can be bookmarked, shared, and opened from a dashboard chart.
 */
export function useListParams(defaults: { sort?: string; pageSize?: number } = {}) {
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Number(params.get('page') ?? 1) || 1);
  const pageSize = Number(params.get('pageSize') ?? defaults.pageSize ?? DEFAULT_PAGE_SIZE) || DEFAULT_PAGE_SIZE;
  const sort = params.get('sort') ?? defaults.sort ?? '';
  const q = params.get('q') ?? '';

  const filters = useMemo(() => {
    const result: Record<string, string> = {};
    params.forEach((value, key) => {
      if (!['page', 'pageSize', 'sort', 'q'].includes(key)) result[key] = value;
    });
    return result;
  }, [params]);

  const update = useCallback(
    (changes: Record<string, string | number | null | undefined>, { resetPage = true } = {}) => {
      setParams(
        () => {
          // From the address bar itself, not the params of the last render: two changes in quick
          // succession (a filter, then another) must both land.
          const next = new URLSearchParams(window.location.search);
          for (const [key, value] of Object.entries(changes)) {
            if (value === null || value === undefined || value === '') next.delete(key);
            else next.set(key, String(value));
          }
          if (resetPage && !('page' in changes)) next.delete('page');
          return next;
        },
        { replace: true },
      );
    },
    [setParams],
  );

  const query = useMemo(
    () => ({ page, pageSize, ...(sort ? { sort } : {}), ...(q ? { q } : {}), ...filters }),
    [page, pageSize, sort, q, filters],
  );

  return { page, pageSize, sort, q, filters, query, update };
}
