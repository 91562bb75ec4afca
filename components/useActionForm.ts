'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { ActionResult } from '@/lib/actions/define-action';
import type { FieldIssue } from '@/lib/http/zod-issues';
import { issuesByField } from './FormError';

/**
 * The submit cycle every form shares: run a server action with the form's data, show its
 * message and field issues on failure; on success clear the form and refresh the page's data.
 */
export function useActionForm() {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [issues, setIssues] = useState<FieldIssue[]>([]);
  const [busy, setBusy] = useState(false);

  function fail(text: string, details: unknown = []) {
    setMessage(text);
    setIssues(Array.isArray(details) ? (details as FieldIssue[]) : []);
  }

  function handler<T>(
    run: (data: FormData) => Promise<ActionResult<T>> | ActionResult<T> | null,
    onSuccess?: (data: T) => void,
    { reset = true }: { reset?: boolean } = {},
  ) {
    return async (event: React.FormEvent<HTMLFormElement>) => {
      event.preventDefault();
      const element = event.currentTarget;
      setBusy(true);
      const result = await run(new FormData(element));
      setBusy(false);
      if (!result) return; // the form refused before calling the server (and said why)
      if (!result.ok) return fail(result.error.message, result.error.details);
      if (reset) element.reset();
      setMessage(null);
      setIssues([]);
      onSuccess?.(result.data);
      router.refresh();
    };
  }

  return { handler, fail, message, issues, errors: issuesByField(issues), busy };
}
