// Problems as the reader reports them: where (file › entry, line, column) and what was expected.

export type Problem = Record<string, unknown>;

const SEVERITY: Record<string, string> = { error: '✕ not read', skipped: '– row skipped', warning: '! note' };

function where(p: Problem): string {
  const parts: string[] = [];
  if (typeof p.entry === 'string') parts.push(p.entry);
  if (typeof p.line === 'number') parts.push(`line ${p.line}`);
  if (typeof p.column === 'number') parts.push(`column ${p.column}${typeof p.columnName === 'string' && p.columnName ? ` (${p.columnName})` : ''}`);
  return parts.join(', ') || 'whole file';
}

export function ProblemList({ problems, limit = 50, testId }: { problems: Problem[]; limit?: number; testId?: string }) {
  if (problems.length === 0) return null;
  const shown = problems.slice(0, limit);
  return (
    <div className="overflow-x-auto">
      <table className="data-table text-xs" data-testid={testId}>
        <thead><tr><th>Where</th><th>Problem</th><th>Expected</th><th>Found</th><th /></tr></thead>
        <tbody>
          {shown.map((p, i) => (
            <tr key={i}>
              <td className="whitespace-nowrap">{where(p)}</td>
              <td>{String(p.message ?? p.code ?? '')}</td>
              <td className="text-ink-soft">{typeof p.expected === 'string' ? p.expected : ''}</td>
              <td className="tag-text text-ink-soft">{typeof p.found === 'string' ? p.found : ''}</td>
              <td className="whitespace-nowrap">{SEVERITY[String(p.severity)] ?? String(p.severity ?? '')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {problems.length > limit && <p className="mt-1 text-xs text-ink-soft">{problems.length - limit} more problems are not shown here.</p>}
    </div>
  );
}
