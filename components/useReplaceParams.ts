'use client';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useEffect, useRef } from 'react';

/**
 * Changes some of the page's query parameters in place (router.replace), keeping the others.
 * router.replace updates the URL only when its transition commits, so two changes made close
 * together (a debounced search, then a filter chosen meanwhile) must build on each other's
 * request, not on the URL of the moment, or the second undoes the first: the requests not yet
 * shown in the URL are kept here until it shows them.
 */
export function useReplaceParams(): (changes: Record<string, string | null>) => void {
  const router = useRouter();
  const pathname = usePathname();
  const queryString = useSearchParams().toString();
  const requested = useRef<string[]>([]);
  useEffect(() => {
    const at = requested.current.indexOf(queryString);
    // Our own request arrived (and those before it); any other URL is a navigation of the user's.
    requested.current = at >= 0 ? requested.current.slice(at + 1) : [];
  }, [queryString]);

  // Read at call time (a debounced caller may hold an old render's function): the newest request,
  // or else the URL as it is now.
  return useCallback((changes: Record<string, string | null>) => {
    const next = new URLSearchParams(requested.current.at(-1) ?? window.location.search);
    for (const [key, value] of Object.entries(changes)) {
      if (value) next.set(key, value);
      else next.delete(key);
    }
    requested.current.push(next.toString());
    router.replace(`${pathname}?${next.toString()}`, { scroll: false });
  }, [router, pathname]);
}
