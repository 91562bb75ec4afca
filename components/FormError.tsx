import type { FieldIssue } from '@/lib/http/zod-issues';

/** The message of a failed submit, with any issue that belongs to no visible field. */
export function FormError({ message, issues = [], fields = [] }: { message: string | null; issues?: FieldIssue[]; fields?: string[] }) {
  if (!message) return null;
  const loose = issues.filter((i) => !fields.includes(i.path.split('.').pop() ?? ''));
  return (
    <div role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">
      <p>{message}</p>
      {loose.length > 0 && <ul className="mt-1 list-disc pl-5">{loose.map((i) => <li key={i.path + i.message}>{i.path ? `${i.path}: ` : ''}{i.message}</li>)}</ul>}
    </div>
  );
}

/** Field errors keyed by the last segment of their path (trap.tag → tag). */
export function issuesByField(issues: FieldIssue[] | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues ?? []) out[issue.path.split('.').pop() ?? ''] ??= issue.message;
  return out;
}
