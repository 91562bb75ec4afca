'use client';

import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/**
 * A submit button that stays disabled until the page has hydrated: a click before that would
 * submit the form natively, past its validation (and could put its fields in the URL).
 */
export function SubmitButton({ children, busy = false, className = 'btn-primary', disabled = false }: {
  children: React.ReactNode; busy?: boolean; className?: string; disabled?: boolean;
}) {
  const hydrated = useSyncExternalStore(subscribe, () => true, () => false);
  return (
    <button type="submit" className={className} disabled={!hydrated || busy || disabled} aria-busy={busy}>
      {children}
    </button>
  );
}
