// Problems as the reader reports them: where (file › entry, line, column), what was wrong,
// what was expected and what was found. A list, so it reads as well in a narrow column.

export type Problem = Record<string, unknown>;

const SEVERITY: Record<string, string> = { error: '✕ file not read', skipped: '– row skipped', warning: '! note' };

const text = (v: unknown) => (typeof v === 'string' && v ? v : null);

function where(p: Problem): string {
  const parts: string[] = [];
  if (text(p.entry)) parts.push(String(p.entry));
  if (typeof p.line === 'number') parts.push(`line ${p.line}`);
  if (typeof p.column === 'number') parts.push(`column ${p.column}${text(p.columnName) ? ` (${p.columnName})` : ''}`);
  return parts.join(', ') || 'whole file';
}

/** The reader's message repeats the place and the expectation, shown apart here. */
function what(p: Problem): string {
  let m = text(p.message) ?? String(p.code ?? '');
  const colon = m.indexOf(': ');
  if (text(p.file) && m.startsWith(String(p.file)) && colon > 0) m = m.slice(colon + 2);
  const expected = text(p.expected);
  if (expected && m.endsWith(`; expected ${expected}`)) m = m.slice(0, -(`; expected ${expected}`.length));
  const found = text(p.found);
  if (found) m = m.replace(new RegExp(`, found "${found.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}"$`), '');
  return m;
}

export function ProblemList({ problems, limit = 50, testId }: { problems: Problem[]; limit?: number; testId?: string }) {
  if (problems.length === 0) return null;
  const shown = problems.slice(0, limit);
  return (
    <div>
      <ul className="divide-y divide-line text-sm" data-testid={testId}>
        {shown.map((p, i) => (
          <li key={i} className="py-2">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <span className="font-medium">{where(p)}</span>
              <span className="text-xs text-ink-soft">{SEVERITY[String(p.severity)] ?? String(p.severity ?? '')}</span>
            </div>
            <p>{what(p)}</p>
            {(text(p.expected) || text(p.found)) && (
              <p className="text-xs text-ink-soft">
                {text(p.expected) && <>Expected: {String(p.expected)}</>}
                {text(p.expected) && text(p.found) && ' · '}
                {text(p.found) && <>found: <span className="tag-text">{String(p.found)}</span></>}
              </p>
            )}
          </li>
        ))}
      </ul>
      {problems.length > limit && <p className="mt-1 text-xs text-ink-soft">{problems.length - limit} more problems are not shown here.</p>}
    </div>
  );
}
