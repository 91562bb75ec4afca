'use client';

import { useEffect, useState } from 'react';
import type { ColumnOption } from './draftProfile';

export function ColumnSelect({ label, value, options, onChange, allowNone, testId }: {
  label: string; value: number | null; options: ColumnOption[]; onChange: (v: number | null) => void; allowNone?: string; testId?: string;
}) {
  return (
    <label className="block">
      <span className="field-label">{label}</span>
      <select className="field-input" value={value ?? ''} onChange={(e) => onChange(e.target.value === '' ? null : Number(e.target.value))} data-testid={testId}>
        {allowNone && <option value="">{allowNone}</option>}
        {options.map((o) => <option key={o.index} value={o.index}>{o.label}</option>)}
      </select>
    </label>
  );
}

export function Choice<T extends string>({ label, value, options, onChange, testId }: {
  label: string; value: T; options: readonly (readonly [T, string])[]; onChange: (v: T) => void; testId?: string;
}) {
  return (
    <label className="block">
      <span className="field-label">{label}</span>
      <select className="field-input" value={value} onChange={(e) => onChange(e.target.value as T)} data-testid={testId}>
        {options.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
      </select>
    </label>
  );
}

/** Text that is committed when it is valid; what is typed stays as typed meanwhile. */
export function TextField({ label, value, onCommit, placeholder, hint, validate, testId, mono }: {
  label: string; value: string; onCommit: (v: string) => void; placeholder?: string; hint?: string; validate?: (v: string) => string | null; testId?: string; mono?: boolean;
}) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  const problem = validate ? validate(text) : null;
  return (
    <label className="block">
      <span className="field-label">{label}</span>
      <input
        className={`field-input ${mono ? 'tag-text' : ''}`}
        value={text}
        placeholder={placeholder}
        data-testid={testId}
        aria-invalid={problem ? true : undefined}
        onChange={(e) => {
          setText(e.target.value);
          if (!validate || !validate(e.target.value)) onCommit(e.target.value);
        }}
      />
      {problem ? <p className="field-error">{problem}</p> : hint ? <p className="mt-1 text-xs text-ink-faint">{hint}</p> : null}
    </label>
  );
}

export function NumberField({ label, value, onCommit, hint, min, max, testId }: {
  label: string; value: number; onCommit: (v: number) => void; hint?: string; min?: number; max?: number; testId?: string;
}) {
  return (
    <TextField
      label={label}
      value={String(value)}
      hint={hint}
      testId={testId}
      validate={(t) => {
        const n = Number(t.replace(',', '.'));
        if (t.trim() === '' || !Number.isFinite(n)) return 'A number, e.g. 1 or -2.5.';
        if (min !== undefined && n < min) return `At least ${min}.`;
        if (max !== undefined && n > max) return `At most ${max}.`;
        return null;
      }}
      onCommit={(t) => onCommit(Number(t.replace(',', '.')))}
    />
  );
}

/** A list typed as comma-separated words ("pipe, ref"). */
export function ListField({ label, value, onCommit, hint, requireOne }: { label: string; value: string[]; onCommit: (v: string[]) => void; hint?: string; requireOne?: boolean }) {
  return (
    <TextField
      label={label}
      value={value.join(', ')}
      hint={hint}
      validate={(t) => (requireOne && !t.split(',').some((s) => s.trim()) ? 'At least one value.' : null)}
      onCommit={(t) => onCommit(t.split(',').map((s) => s.trim()).filter(Boolean))}
    />
  );
}

export function regexProblem(text: string): string | null {
  if (!text.trim()) return 'A pattern is required.';
  try {
    new RegExp(text);
    return null;
  } catch {
    return 'Not a valid regular expression.';
  }
}

export function zoneProblem(text: string): string | null {
  try {
    new Intl.DateTimeFormat('en', { timeZone: text });
    return null;
  } catch {
    return 'Not a known IANA time zone, e.g. Europe/Amsterdam.';
  }
}
