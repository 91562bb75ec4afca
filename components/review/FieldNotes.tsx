'use client';

import { useCallback, useEffect, useState } from 'react';
import {
  FIELD_NOTE_KIND_LABELS, fieldNoteInputSchema, PHOTO_MAX_BYTES, PHOTO_TYPES, WRITTEN_NOTE_KINDS,
  type FieldNoteKindCode,
} from '@/lib/api/field-note-routes';
import type { FieldNoteDto } from '@/lib/services/field-notes';

type NoteList = { items: FieldNoteDto[]; canAdd: boolean };

/** A small mark per kind, so a note reads without its colour. */
const KIND_MARK: Record<FieldNoteKindCode, string> = {
  not_reachable: '⊘', line_out_of_service: '⏻', insulation_missing: '≋', photo: '▣', remark: '✎',
};

async function errorOf(res: Response) {
  const body = await res.json().catch(() => null);
  return (body?.error?.message as string | undefined) ?? `The server answered ${res.status}.`;
}

/** One note as a line: kind, words, photo thumbnail, who and when. */
export function FieldNoteItem({ note, onDelete, showSurvey, onThisTest }: {
  note: FieldNoteDto; onDelete?: () => void; showSurvey?: boolean; onThisTest?: boolean;
}) {
  return (
    <li className="flex gap-3 border-b border-line py-2 last:border-0" data-testid="field-note">
      {note.photo ? (
        <a href={note.photo.url} target="_blank" rel="noreferrer" className="shrink-0" title="Open the photo">
          {/* A stored photo of our own API, not a static asset: next/image would only proxy it. */}
          {/* eslint-disable-next-line @next/next/no-img-element */}
          <img src={note.photo.url} alt={`Photo of ${note.trapTag ?? 'the trap'}${note.text ? `: ${note.text}` : ''}`} className="h-16 w-16 rounded border border-line object-cover" loading="lazy" />
        </a>
      ) : (
        <span aria-hidden="true" className="mt-0.5 w-5 shrink-0 text-center text-ink-soft">{KIND_MARK[note.kind]}</span>
      )}
      <div className="min-w-0 flex-1 text-sm">
        <div className="flex flex-wrap items-baseline gap-x-2">
          <span className="font-medium" data-testid="field-note-kind">{FIELD_NOTE_KIND_LABELS[note.kind]}</span>
          {onThisTest && <span className="rounded bg-accent-50 px-1.5 text-xs text-accent-800">on this test</span>}
          {showSurvey && note.surveyName && <span className="text-xs text-ink-soft">{note.surveyName}</span>}
        </div>
        {note.text && <p className="break-words text-ink-soft">{note.text}</p>}
        <p className="text-xs text-ink-faint">{note.createdBy ?? 'someone no longer here'} · <time dateTime={note.createdAt}>{note.createdAt.replace('T', ' ').slice(0, 16)} UTC</time></p>
      </div>
      {note.canDelete && onDelete && (
        <button type="button" className="self-start text-xs text-danger-ink hover:underline" onClick={onDelete} aria-label={`Delete note “${FIELD_NOTE_KIND_LABELS[note.kind]}”`}>Delete</button>
      )}
    </li>
  );
}

/** Add a note or a photo to a trap in a survey; the server decides again. */
export function AddFieldNote({ surveyId, trapId, testId, onAdded }: { surveyId: number; trapId: number; testId?: number; onAdded: () => void }) {
  const [kind, setKind] = useState<(typeof WRITTEN_NOTE_KINDS)[number]>('not_reachable');
  const [text, setText] = useState('');
  const [photo, setPhoto] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const base = `/api/surveys/${surveyId}/traps/${trapId}/field-notes`;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    let res: Response;
    if (photo) {
      if (!(PHOTO_TYPES as readonly string[]).includes(photo.type)) return setError('Choose a PNG, JPEG or WebP photo.');
      if (photo.size > PHOTO_MAX_BYTES) return setError(`A photo is at most ${PHOTO_MAX_BYTES / 1024 / 1024} MB.`);
      const form = new FormData();
      if (text.trim()) form.append('text', text.trim());
      if (testId) form.append('testId', String(testId));
      form.append('photo', photo, photo.name);
      setBusy(true);
      res = await fetch(`${base}/photo`, { method: 'POST', body: form });
    } else {
      const parsed = fieldNoteInputSchema.safeParse({ kind, text: text.trim() || undefined, testId: testId ?? null });
      if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the note.');
      setBusy(true);
      res = await fetch(base, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(parsed.data) });
    }
    setBusy(false);
    if (!res.ok) return setError(await errorOf(res));
    setText('');
    setPhoto(null);
    (e.target as HTMLFormElement).reset();
    onAdded();
  }

  return (
    <form className="space-y-2 rounded-md border border-line p-3" onSubmit={submit} data-testid="add-field-note">
      <div className="grid gap-2 sm:grid-cols-2">
        <label className="block"><span className="field-label">What you found</span>
          <select className="field-input" value={kind} onChange={(e) => setKind(e.target.value as typeof kind)} disabled={!!photo} aria-label="Note kind">
            {WRITTEN_NOTE_KINDS.map((k) => <option key={k} value={k}>{FIELD_NOTE_KIND_LABELS[k]}</option>)}
          </select>
        </label>
        <label className="block"><span className="field-label">Photo (optional)</span>
          <input type="file" accept={PHOTO_TYPES.join(',')} className="field-input text-xs" aria-label="Photo" onChange={(e) => setPhoto(e.target.files?.[0] ?? null)} />
        </label>
      </div>
      <label className="block"><span className="field-label">Words (optional, needed for a remark)</span>
        <textarea className="field-input" rows={2} value={text} onChange={(e) => setText(e.target.value)} aria-label="Note text" maxLength={2000}
          placeholder="Where, what you saw: scaffold needed, valve closed, lagging off…" />
      </label>
      <div className="flex items-center gap-3">
        <button type="submit" className="btn-primary" disabled={busy}>{photo ? 'Add photo' : 'Add note'}</button>
        {photo && <span className="text-xs text-ink-soft">A photo is added as a “Photo” note with your words.</span>}
      </div>
      {error && <p role="alert" className="field-error">{error}</p>}
    </form>
  );
}

/**
 * Field notes on a trap: in one survey (with the add form, and notes on `testId` marked), or
 * across every survey of the trap when no survey is given (the trap page).
 */
export function FieldNotes({ trapId, surveyId, testId, onChanged }: { trapId: number; surveyId?: number; testId?: number; onChanged?: () => void }) {
  const [list, setList] = useState<NoteList | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [adding, setAdding] = useState(false);
  const url = surveyId ? `/api/surveys/${surveyId}/traps/${trapId}/field-notes` : `/api/traps/${trapId}/field-notes`;

  const load = useCallback(async () => {
    const res = await fetch(url, { cache: 'no-store' });
    if (!res.ok) return setError(await errorOf(res));
    setError(null);
    setList(await res.json());
  }, [url]);
  useEffect(() => { void load(); }, [load]);

  const changed = () => { void load(); onChanged?.(); };
  async function remove(note: FieldNoteDto) {
    if (!window.confirm(`Delete the note “${FIELD_NOTE_KIND_LABELS[note.kind]}”?`)) return;
    const res = await fetch(`/api/surveys/${note.surveyId}/field-notes/${note.id}`, { method: 'DELETE' });
    if (!res.ok) return setError(await errorOf(res));
    changed();
  }

  return (
    <section className="panel p-4" aria-label="Field notes" data-testid="field-notes">
      <div className="mb-1 flex items-center justify-between gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Field notes{list ? ` (${list.items.length})` : ''}</h3>
        {surveyId && list?.canAdd && !adding && <button type="button" className="btn-quiet" onClick={() => setAdding(true)}>Add a note</button>}
      </div>
      {error && <p role="alert" className="field-error">{error}</p>}
      {!list && !error && <p className="text-sm text-ink-faint">Loading notes…</p>}
      {list && list.items.length === 0 && <p className="text-sm text-ink-soft">No field notes{surveyId ? ' in this survey' : ''}.</p>}
      {list && list.items.length > 0 && (
        <ul>{list.items.map((n) => <FieldNoteItem key={n.id} note={n} showSurvey={!surveyId} onThisTest={!!testId && n.testId === testId} onDelete={() => remove(n)} />)}</ul>
      )}
      {surveyId && adding && (
        <div className="mt-2 space-y-1">
          <AddFieldNote surveyId={surveyId} trapId={trapId} testId={testId} onAdded={() => { setAdding(false); changed(); }} />
          <button type="button" className="text-xs text-ink-soft hover:underline" onClick={() => setAdding(false)}>Close</button>
        </div>
      )}
    </section>
  );
}
