import {
  SOURCE_FILE_STATUS_LABELS, UPLOAD_STATUS_LABELS, type SourceFileStatus, type UploadStatus,
} from '@/lib/domain/vocabulary';

// A state is told by a word and a mark, never by colour alone.
const UPLOAD_MARK: Record<UploadStatus, string> = {
  received: '○', queued: '○', processing: '◐', waiting_for_mapping: '◇', done: '●', failed: '✕',
};
const FILE_MARK: Record<SourceFileStatus, string> = {
  pending: '○', needs_mapping: '◇', processed: '●', failed: '✕', duplicate: '=', skipped: '–', unpacked: '▸',
};

export const BUSY_STATUSES: readonly UploadStatus[] = ['received', 'queued', 'processing'];

export function UploadStatusLabel({ status }: { status: UploadStatus }) {
  const tone = status === 'failed' ? 'text-danger-ink' : status === 'waiting_for_mapping' ? 'text-caution-ink' : 'text-ink-soft';
  return (
    <span className={`inline-flex items-center gap-1 text-xs ${tone}`} data-testid="upload-status">
      <span aria-hidden="true">{UPLOAD_MARK[status]}</span>
      {UPLOAD_STATUS_LABELS[status]}
    </span>
  );
}

export function FileStatusLabel({ status }: { status: SourceFileStatus }) {
  const tone = status === 'failed' ? 'text-danger-ink' : status === 'needs_mapping' ? 'text-caution-ink' : 'text-ink-soft';
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap text-xs ${tone}`}>
      <span aria-hidden="true">{FILE_MARK[status]}</span>
      {SOURCE_FILE_STATUS_LABELS[status]}
    </span>
  );
}

export function ProgressBar({ done, total, label }: { done: number; total: number; label: string }) {
  const pct = total > 0 ? Math.min(100, Math.round((done / total) * 100)) : 0;
  return (
    <div>
      <div className="h-2 overflow-hidden rounded-full bg-surface-sunken" role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct}>
        <div className="h-full rounded-full bg-accent-500 transition-[width] duration-300" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
