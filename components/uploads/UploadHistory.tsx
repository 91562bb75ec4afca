'use client';

import Link from 'next/link';
import { useEffect } from 'react';
import type { UploadDto } from '@/lib/services/uploads';
import { formatWhen, uploadPath } from './apiClient';
import { BUSY_STATUSES, ProgressBar, UploadStatusLabel } from './StatusLabel';
import { usePolling } from './usePolling';

/** This site's uploads, newest first; polled while any of them is still being read. */
export function UploadHistory({ siteId, refreshKey }: { siteId: number; refreshKey: number }) {
  const { data, error, reload } = usePolling<{ items: UploadDto[] }>(
    `/api/sites/${siteId}/uploads`,
    (d) => d.items.some((u) => BUSY_STATUSES.includes(u.status)),
    1500,
  );
  // A new upload from the drop zone: load the list again (and poll while it is read).
  useEffect(() => {
    if (refreshKey > 0) reload();
  }, [refreshKey, reload]);
  return (
    <section className="panel p-5" aria-labelledby="history-heading">
      <h2 id="history-heading" className="mb-3 font-semibold">Uploads of this site</h2>
      {error && <p role="alert" className="text-sm text-danger-ink">{error.message}</p>}
      {!data && !error && <p className="text-sm text-ink-soft">Loading…</p>}
      {data && data.items.length === 0 && <p className="text-sm text-ink-soft">Nothing uploaded yet.</p>}
      {data && data.items.length > 0 && (
        <table className="data-table" data-testid="upload-history">
          <thead>
            <tr><th>Upload</th><th>Survey</th><th>By</th><th>When</th><th>Status</th><th className="w-48">Files read</th><th className="text-right">Tests</th></tr>
          </thead>
          <tbody>
            {data.items.map((u) => (
              <tr key={u.id}>
                <td><Link href={uploadPath(siteId, u.id)} className="font-medium text-accent-700 hover:underline">#{u.id}</Link></td>
                <td>{u.surveyName ?? '—'}</td>
                <td>{u.createdBy ?? '—'}</td>
                <td className="whitespace-nowrap">{formatWhen(u.createdAt)}</td>
                <td><UploadStatusLabel status={u.status} /></td>
                <td>
                  <div className="flex items-center gap-2">
                    <div className="flex-1"><ProgressBar done={u.progress.filesDone} total={u.progress.filesTotal} label={`Upload ${u.id} files read`} /></div>
                    <span className="whitespace-nowrap text-xs text-ink-soft">{u.progress.filesDone} / {u.progress.filesTotal}</span>
                  </div>
                </td>
                <td className="text-right">{u.progress.tests}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
