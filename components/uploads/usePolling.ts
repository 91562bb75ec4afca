'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { callApi, type ApiFailure } from './apiClient';

/**
 * Loads a JSON resource and, while `keepPolling(data)` says so, loads it again every
 * `intervalMs`. `reload()` fetches at once (after an action changed it).
 */
export function usePolling<T>(url: string, keepPolling: (data: T) => boolean, intervalMs = 1000) {
  const [data, setData] = useState<T | null>(null);
  const [error, setError] = useState<ApiFailure | null>(null);
  const [tick, setTick] = useState(0);
  const keep = useRef(keepPolling);
  keep.current = keepPolling;

  useEffect(() => {
    const controller = new AbortController();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const load = async () => {
      try {
        const result = await callApi<T>(url, { signal: controller.signal });
        if (controller.signal.aborted) return;
        if (result.ok) {
          setData(result.data);
          setError(null);
          if (keep.current(result.data)) timer = setTimeout(load, intervalMs);
        } else {
          setError(result.error);
          if (result.error.status === 0) timer = setTimeout(load, intervalMs * 3);
        }
      } catch {
        // aborted
      }
    };
    load();
    return () => {
      controller.abort();
      clearTimeout(timer);
    };
  }, [url, intervalMs, tick]);

  const reload = useCallback(() => setTick((t) => t + 1), []);
  return { data, error, reload, setData };
}
