'use client';

import Link from 'next/link';
import { useRef, useState, useSyncExternalStore } from 'react';
import { SURVEY_STATUS_LABELS, type SurveyStatus } from '@/lib/domain/vocabulary';
import { failureOf, formatBytes, uploadPath } from './apiClient';
import { ProgressBar } from './StatusLabel';

type SurveyChoice = { id: number; name: string; status: SurveyStatus };
type Picked = { key: string; file: File };
type Sending = { loaded: number[]; state: 'sending' | 'received' };

const subscribe = () => () => {};

/**
 * Many files and zips at once, by dropping or picking, sent as one multipart upload.
 * Parts go in the order chosen, so the bytes the browser reports sent are attributed to the
 * files one after another: each file shows its own progress.
 */
export function UploadDropZone({ siteId, surveys, defaultSurveyId, onUploaded }: {
  siteId: number; surveys: SurveyChoice[]; defaultSurveyId: number | null; onUploaded?: () => void;
}) {
  const hydrated = useSyncExternalStore(subscribe, () => true, () => false);
  const input = useRef<HTMLInputElement>(null);
  const [surveyId, setSurveyId] = useState<number | null>(defaultSurveyId);
  const [picked, setPicked] = useState<Picked[]>([]);
  const [over, setOver] = useState(false);
  const [sending, setSending] = useState<Sending | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState<{ id: number; files: number } | null>(null);

  const survey = surveys.find((s) => s.id === surveyId) ?? null;
  const frozen = survey?.status === 'published';
  const totalBytes = picked.reduce((n, p) => n + p.file.size, 0);

  function add(list: FileList | null) {
    if (!list) return;
    // Copied now: the input's FileList is live and is emptied when the input is reset.
    const files = Array.from(list);
    setError(null);
    setSent(null);
    setSending(null);
    setPicked((current) => {
      const known = new Set(current.map((p) => p.key));
      const next = [...current];
      for (const file of files) {
        const key = `${file.name}:${file.size}:${file.lastModified}`;
        if (!known.has(key)) next.push({ key, file });
        known.add(key);
      }
      return next;
    });
  }

  function send() {
    if (!survey || picked.length === 0 || frozen) return;
    const form = new FormData();
    for (const p of picked) form.append('files', p.file, p.file.name);
    const sizes = picked.map((p) => p.file.size);
    const xhr = new XMLHttpRequest();
    setError(null);
    setSending({ loaded: sizes.map(() => 0), state: 'sending' });
    xhr.upload.onprogress = (e) => {
      // The body is the files plus a few hundred bytes of part headers each: scale the
      // overhead away, then fill the files in order.
      const payload = e.lengthComputable && e.total > 0 ? (e.loaded / e.total) * totalBytes : e.loaded;
      let rest = payload;
      const loaded = sizes.map((size) => {
        const part = Math.max(0, Math.min(size, rest));
        rest -= size;
        return part;
      });
      setSending({ loaded, state: 'sending' });
    };
    xhr.upload.onload = () => setSending({ loaded: sizes, state: 'received' });
    xhr.onerror = () => {
      setSending(null);
      setError('The connection closed before the upload finished. If the files are large, the server may have refused them for their size; otherwise check the connection and try again.');
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      if (xhr.status === 201) {
        const id = (body as { id: number }).id;
        setSent({ id, files: picked.length });
        setPicked([]);
        setSending(null);
        onUploaded?.();
        return;
      }
      setSending(null);
      const failure = failureOf(xhr.status, body);
      const lead = xhr.status === 413 ? 'Refused for its size: ' : xhr.status === 409 ? 'Refused: ' : '';
      setError(lead + failure.message);
    };
    xhr.open('POST', `/api/surveys/${survey.id}/uploads`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.send(form);
  }

  const busy = sending !== null;

  return (
    <section className="panel space-y-4 p-5" aria-labelledby="upload-heading">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 id="upload-heading" className="font-semibold">Upload meter files</h2>
          <p className="text-sm text-ink-soft">CSV exports and zips of day folders, as many as you have. A layout Plumeward has not seen before waits for a column mapping; the rest are read at once.</p>
        </div>
        <label className="block min-w-64">
          <span className="field-label">Into survey</span>
          <select
            className="field-input"
            value={surveyId ?? ''}
            onChange={(e) => { setSurveyId(Number(e.target.value) || null); setError(null); }}
            disabled={busy}
          >
            {surveys.length === 0 && <option value="">No survey yet</option>}
            {surveys.map((s) => (
              <option key={s.id} value={s.id}>{s.name} — {SURVEY_STATUS_LABELS[s.status]}{s.status === 'published' ? ' (frozen)' : ''}</option>
            ))}
          </select>
        </label>
      </div>
      {surveys.length === 0 && <p className="text-sm text-ink-soft">This site has no survey. An analyst plans one under Surveys before files can be uploaded.</p>}
      {frozen && (
        <p role="note" className="rounded-md border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution-ink">
          {survey?.name} is published: its results are frozen and it takes no more files. Choose a survey in progress.
        </p>
      )}

      <div
        className={`flex flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed px-4 py-8 text-center text-sm ${over ? 'border-accent-500 bg-accent-50' : 'border-line-strong bg-surface'}`}
        onDragOver={(e) => { e.preventDefault(); setOver(true); }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => { e.preventDefault(); setOver(false); if (!busy) add(e.dataTransfer.files); }}
        data-testid="drop-zone"
      >
        <svg viewBox="0 0 24 24" className="h-7 w-7 text-ink-faint" aria-hidden="true"><path d="M12 15V4m0 0-4 4m4-4 4 4M5 15v3a2 2 0 0 0 2 2h10a2 2 0 0 0 2-2v-3" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" /></svg>
        <p>Drop files and zips here, or</p>
        <button type="button" className="btn-quiet" disabled={!hydrated || busy} onClick={() => input.current?.click()}>Choose files…</button>
        <input
          ref={input}
          type="file"
          multiple
          accept=".csv,.txt,.tsv,.dat,.zip,text/csv,text/plain,application/zip"
          className="sr-only"
          aria-label="Meter files"
          data-testid="upload-input"
          onChange={(e) => { add(e.target.files); e.target.value = ''; }}
        />
      </div>

      {picked.length > 0 && (
        <div className="space-y-3">
          <table className="data-table" data-testid="picked-files">
            <thead><tr><th>File</th><th className="text-right">Size</th><th className="w-1/3">Sent</th><th /></tr></thead>
            <tbody>
              {picked.map((p, i) => {
                const loaded = sending?.loaded[i] ?? 0;
                const pct = p.file.size ? Math.round((loaded / p.file.size) * 100) : sending ? 100 : 0;
                return (
                  <tr key={p.key}>
                    <td className="break-all">{p.file.name}</td>
                    <td className="text-right whitespace-nowrap">{formatBytes(p.file.size)}</td>
                    <td>
                      {sending ? (
                        <div className="flex items-center gap-2">
                          <div className="flex-1"><ProgressBar done={loaded} total={p.file.size || 1} label={`${p.file.name} sent`} /></div>
                          <span className="w-10 text-right text-xs text-ink-soft">{pct} %</span>
                        </div>
                      ) : <span className="text-xs text-ink-faint">not sent yet</span>}
                    </td>
                    <td className="text-right">
                      {!busy && <button type="button" className="text-xs text-ink-soft hover:underline" onClick={() => setPicked((c) => c.filter((x) => x.key !== p.key))}>Remove</button>}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <div className="flex flex-wrap items-center gap-3">
            <button type="button" className="btn-primary" disabled={!hydrated || busy || !survey || frozen} onClick={send}>
              {sending?.state === 'received' ? 'Storing…' : busy ? 'Sending…' : `Upload ${picked.length} file${picked.length === 1 ? '' : 's'} (${formatBytes(totalBytes)})`}
            </button>
            {!busy && <button type="button" className="btn-quiet" onClick={() => setPicked([])}>Clear</button>}
          </div>
        </div>
      )}

      {error && <p role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">{error}</p>}
      {sent && (
        <p role="status" className="rounded-md border border-accent-200 bg-accent-50 px-3 py-2 text-sm">
          {sent.files} file{sent.files === 1 ? '' : 's'} received and kept as sent.{' '}
          <Link href={uploadPath(siteId, sent.id)} className="font-medium text-accent-700 hover:underline">Open upload #{sent.id}</Link> to follow the import.
        </p>
      )}
    </section>
  );
}
