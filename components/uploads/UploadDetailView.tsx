'use client';

import Link from 'next/link';
import { Fragment, useEffect, useMemo, useState } from 'react';
import type { ProfileDto } from '@/lib/services/instrument-profiles';
import type { TestDto } from '@/lib/services/tests';
import type { SourceFileDto, UploadDetail } from '@/lib/services/uploads';
import { callApi, formatBytes, formatWhen, uploadPath, wizardPath } from './apiClient';
import { ProblemList, type Problem } from './ProblemList';
import { ReprocessPanel } from './ReprocessPanel';
import { BUSY_STATUSES, FileStatusLabel, ProgressBar, UploadStatusLabel } from './StatusLabel';
import { usePolling } from './usePolling';

const fmt = (v: number | null, digits = 1, unit = '') => (v === null || v === undefined ? '—' : `${v.toFixed(digits)}${unit}`);

/** One upload, live: polled while queued or processing, then its files, problems and tests. */
export function UploadDetailView({ siteId, uploadId, canMap, siteTimeZone }: { siteId: number; uploadId: number; canMap: boolean; siteTimeZone: string }) {
  const { data: upload, error, reload } = usePolling<UploadDetail>(`/api/uploads/${uploadId}`, (u) => BUSY_STATUSES.includes(u.status), 1000);
  const [profiles, setProfiles] = useState<ProfileDto[]>([]);
  const [tests, setTests] = useState<{ items: TestDto[]; total: number } | null>(null);

  useEffect(() => {
    callApi<{ items: ProfileDto[] }>('/api/instrument-profiles').then((r) => r.ok && setProfiles(r.data.items));
  }, [upload?.status]);

  const testsKey = upload ? `${upload.status}:${upload.progress.tests}:${upload.unmatchedTags.length}` : null;
  useEffect(() => {
    if (!testsKey) return;
    const controller = new AbortController();
    callApi<{ items: TestDto[]; total: number }>(`/api/sites/${siteId}/tests?uploadId=${uploadId}&pageSize=500`, { signal: controller.signal })
      .then((r) => r.ok && setTests(r.data))
      .catch(() => {});
    return () => controller.abort();
  }, [siteId, uploadId, testsKey]);

  const profileName = useMemo(() => new Map(profiles.map((p) => [p.id, p.name])), [profiles]);

  if (error && !upload) return <p role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">{error.message}</p>;
  if (!upload) return <p className="text-sm text-ink-soft">Loading the upload…</p>;

  const busy = BUSY_STATUSES.includes(upload.status);
  const topLevel = upload.files.filter((f) => f.containerId === null);
  const entriesOf = (zipId: number) => upload.files.filter((f) => f.containerId === zipId);
  const filesById = new Map(upload.files.map((f) => [f.id, f]));
  const usedProfileIds = [...new Set(upload.files.map((f) => f.profileId).filter((id): id is number => id !== null))];

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <Link href={`/sites/${siteId}/uploads`} className="text-sm text-ink-soft hover:underline">← Uploads</Link>
          <h2 className="text-lg font-semibold">Upload #{upload.id} · {upload.surveyName ?? 'survey'}</h2>
          <p className="text-sm text-ink-soft">By {upload.createdBy ?? 'someone'} on {formatWhen(upload.createdAt)}{upload.finishedAt ? ` · finished ${formatWhen(upload.finishedAt)}` : ''}</p>
        </div>
        <UploadStatusLabel status={upload.status} />
      </div>

      <section className="panel space-y-2 p-5" aria-label="Progress" data-testid="upload-progress">
        <ProgressBar done={upload.progress.filesDone} total={upload.progress.filesTotal} label="Files read" />
        <p className="text-sm text-ink-soft">
          {upload.progress.filesDone} of {upload.progress.filesTotal} file{upload.progress.filesTotal === 1 ? '' : 's'} read ·{' '}
          <span data-testid="test-count">{upload.progress.tests} test{upload.progress.tests === 1 ? '' : 's'}</span> ·{' '}
          {upload.progress.samples.toLocaleString('en-GB')} readings{busy ? ' · reading in the background, this page updates by itself' : ''}
        </p>
        {upload.error && <p role="alert" className="text-sm text-danger-ink">{upload.error}</p>}
      </section>

      {upload.unknownLayouts.length > 0 && (
        <section className="panel space-y-3 border-caution-line p-5" data-testid="unknown-layouts">
          <h3 className="font-semibold">Files of a layout no instrument profile knows</h3>
          {!canMap && (
            <p role="note" className="rounded-md border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution-ink" data-testid="waits-for-analyst">
              These files wait for an analyst to map their columns once; after that they are read, and later files of the same layout go straight through.
              The rest of this upload has gone through as usual. Nothing needs doing on your side.
            </p>
          )}
          <ul className="space-y-3">
            {upload.unknownLayouts.map((layout) => {
              const draft = upload.mappingDraft?.[layout.fingerprint];
              const names = layout.fileIds.map((id) => filesById.get(id)).filter((f): f is SourceFileDto => !!f).map((f) => f.entry ?? f.name);
              const step = draft && ['format', 'columns', 'save'].includes(draft.step) ? draft.step : 'format';
              return (
                <li key={layout.fingerprint} className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-line p-3">
                  <div className="text-sm">
                    <div className="tag-text text-xs text-ink-faint">{layout.fingerprint}</div>
                    <div>{names.length} file{names.length === 1 ? '' : 's'}: {names.slice(0, 4).join(', ')}{names.length > 4 ? ` and ${names.length - 4} more` : ''}</div>
                    {draft && <div className="text-xs text-ink-soft">Mapping begun by {draft.updatedBy}, {formatWhen(draft.updatedAt)} (at the {draft.step} step)</div>}
                  </div>
                  {canMap && (
                    <Link href={wizardPath(siteId, upload.id, layout.fingerprint, step)} className="btn-primary">
                      {draft ? 'Continue mapping' : 'Map this layout'}
                    </Link>
                  )}
                </li>
              );
            })}
          </ul>
        </section>
      )}

      {upload.unmatchedTags.length > 0 && (
        <section className="panel flex flex-wrap items-center justify-between gap-3 p-5" data-testid="unmatched-tags">
          <div>
            <h3 className="font-semibold">Tags the register does not know</h3>
            <p className="text-sm text-ink-soft">
              {upload.unmatchedTags.length} tag{upload.unmatchedTags.length === 1 ? '' : 's'} ({upload.unmatchedTags.slice(0, 5).map((t) => t.tag).join(', ')}{upload.unmatchedTags.length > 5 ? ', …' : ''}):
              their tests are held back until each tag is matched to a trap, added to the register, or ignored.
            </p>
          </div>
          {canMap ? <Link href={`${uploadPath(siteId, upload.id)}/tags`} className="btn-quiet">Match tags</Link> : <span className="text-sm text-ink-soft">An analyst matches them.</span>}
        </section>
      )}

      <section className="panel p-5">
        <h3 className="mb-3 font-semibold">Files</h3>
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="upload-files">
            <thead><tr><th>File</th><th className="text-right">Size</th><th>Status</th><th>Read with</th><th className="text-right">Tests</th><th className="text-right">Problems</th></tr></thead>
            <tbody>
              {topLevel.map((f) => (
                <Fragment key={f.id}>
                  <FileRow file={f} depth={0} profileName={profileName} duplicateOf={f.duplicateOf ? filesById.get(f.duplicateOf) : undefined} />
                  {entriesOf(f.id).map((e) => <FileRow key={e.id} file={e} depth={1} profileName={profileName} duplicateOf={e.duplicateOf ? filesById.get(e.duplicateOf) : undefined} />)}
                </Fragment>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section className="panel p-5">
        <h3 className="mb-3 font-semibold">Tests imported{tests ? ` (${tests.total})` : ''}</h3>
        {!tests && <p className="text-sm text-ink-soft">Loading…</p>}
        {tests && tests.items.length === 0 && <p className="text-sm text-ink-soft">{busy ? 'Tests appear here as the files are read.' : 'No test from this upload yet.'}</p>}
        {tests && tests.items.length > 0 && (
          <div className="overflow-x-auto">
            <table className="data-table" data-testid="upload-tests">
              <thead>
                <tr><th>Tag</th><th>Point</th><th>Start (site time)</th><th className="text-right">Duration</th><th className="text-right">Mean level</th><th className="text-right">Duty cycle</th><th>Suggested verdict</th><th>Register</th></tr>
              </thead>
              <tbody>
                {tests.items.map((t) => (
                  <tr key={t.id}>
                    <td className="tag-text">{t.tag}</td>
                    <td>{t.role === 'trap' ? 'Trap' : `Reference point${t.linkedTrapTag ? ` of ${t.linkedTrapTag}` : ''}`}</td>
                    <td className="whitespace-nowrap">{formatWhen(t.startedAt, siteTimeZone)}</td>
                    <td className="text-right">{fmt(t.durationS, 1, ' s')}</td>
                    <td className="text-right">{fmt(t.meanLevelDb, 1, ' dB')}</td>
                    <td className="text-right">{t.dutyCycle === null ? '—' : `${Math.round(t.dutyCycle * 100)} %`}</td>
                    <td>{t.suggestedVerdict ? t.suggestedVerdict.replaceAll('_', ' ') : '—'}{t.confidence ? <span className="text-xs text-ink-faint"> · {t.confidence}</span> : null}</td>
                    <td className="text-xs text-ink-soft">{t.matchStatus === 'matched' ? 'matched' : t.matchStatus === 'ignored' ? 'ignored' : 'tag not in register'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {tests.total > tests.items.length && <p className="mt-2 text-xs text-ink-soft">The first {tests.items.length} of {tests.total} tests.</p>}
          </div>
        )}
      </section>

      {canMap && usedProfileIds.length > 0 && !busy && (
        <ReprocessPanel uploadId={upload.id} profiles={usedProfileIds.map((id) => ({ id, name: profileName.get(id) ?? `Profile #${id}`, revision: profiles.find((p) => p.id === id)?.revision ?? null }))} files={upload.files} onDone={reload} />
      )}
    </div>
  );
}

function FileRow({ file, depth, profileName, duplicateOf }: { file: SourceFileDto; depth: number; profileName: Map<number, string>; duplicateOf?: SourceFileDto }) {
  const [open, setOpen] = useState(false);
  const problems = file.problems as Problem[];
  const label = depth ? file.entry ?? file.name : file.name;
  return (
    <>
      <tr data-testid="upload-file" data-status={file.status}>
        <td className={depth ? 'pl-8' : ''}>
          <span className="break-all">{depth ? <span aria-hidden="true" className="text-ink-faint">└ </span> : null}{label}</span>
          {file.kind === 'zip' && <span className="ml-2 rounded border border-line px-1 text-xs text-ink-soft">zip</span>}
          {file.hints.length > 0 && <div className="text-xs text-ink-faint">folder: {file.hints.join(' / ')}</div>}
          {file.status === 'duplicate' && <div className="text-xs text-ink-soft">The same bytes were uploaded before{duplicateOf ? ` (${duplicateOf.entry ?? duplicateOf.name})` : ' into this survey'}: not counted twice.</div>}
        </td>
        <td className="text-right whitespace-nowrap">{formatBytes(file.size)}</td>
        <td><FileStatusLabel status={file.status} /></td>
        <td className="text-sm">{file.profileId ? `${profileName.get(file.profileId) ?? `Profile #${file.profileId}`}${file.profileRevision ? `, rev. ${file.profileRevision}` : ''}` : '—'}</td>
        <td className="text-right">{file.kind === 'zip' ? '' : file.testCount}</td>
        <td className="text-right">
          {problems.length > 0 ? (
            <button type="button" className="text-sm text-accent-700 hover:underline" aria-expanded={open} onClick={() => setOpen(!open)}>
              {problems.length} {open ? '▴' : '▾'}
            </button>
          ) : <span className="text-ink-faint">0</span>}
        </td>
      </tr>
      {open && (
        <tr>
          <td colSpan={6} className="bg-surface"><ProblemList problems={problems} /></td>
        </tr>
      )}
    </>
  );
}
