'use client';

import {
  createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState,
} from '@tanstack/react-table';
import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useState } from 'react';
import {
  CRITICALITY_LABELS, TRAP_STATUSES, TRAP_STATUS_LABELS, TRAP_TYPES, TRAP_TYPE_LABELS,
} from '@/lib/domain/vocabulary';
import type { TrapDto } from '@/lib/services/dto';
import { useReplaceParams } from '../useReplaceParams';

type Page = { items: TrapDto[]; total: number; page: number; pageSize: number };
type Area = { id: number; name: string };

const column = createColumnHelper<TrapDto>();
const PAGE_SIZE = 50;

/** The register of one site: paged, sorted and filtered on the server; the URL holds the state. */
export function TrapRegisterTable({ siteId, areas, canEdit }: { siteId: number; areas: Area[]; canEdit: boolean }) {
  const search = useSearchParams();
  const [data, setData] = useState<Page | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [loading, setLoading] = useState(false);
  const [text, setText] = useState(search.get('q') ?? '');

  const sort = search.get('sort') ?? 'tag';
  const dir = search.get('dir') === 'desc' ? 'desc' : 'asc';
  const page = Math.max(1, Number(search.get('page') ?? 1) || 1);
  const queryString = search.toString();

  const replaceParams = useReplaceParams();
  // A new filter or sort starts again at the first page.
  const setParams = (changes: Record<string, string | null>) => replaceParams({ page: null, ...changes });

  // Debounce typing into the search box before it reaches the URL (and the server).
  useEffect(() => {
    const current = search.get('q') ?? '';
    if (text === current) return;
    const timer = setTimeout(() => setParams({ q: text.trim() || null }), 250);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [text]);

  useEffect(() => {
    const controller = new AbortController();
    const params = new URLSearchParams(queryString);
    params.set('pageSize', String(PAGE_SIZE));
    setLoading(true);
    fetch(`/api/sites/${siteId}/traps?${params}`, { signal: controller.signal })
      .then(async (res) => {
        const body = await res.json();
        if (!res.ok) throw new Error(body?.error?.message ?? `The register could not be loaded (${res.status}).`);
        setData(body as Page);
        setError(null);
      })
      .catch((err: Error) => {
        if (err.name !== 'AbortError') setError(err.message);
      })
      .finally(() => {
        if (!controller.signal.aborted) setLoading(false);
      });
    return () => controller.abort();
  }, [siteId, queryString]);

  const columns = useMemo(
    () => [
      column.accessor('tag', {
        header: 'Tag',
        cell: (info) => (
          <Link href={`/sites/${siteId}/traps/${info.row.original.id}`} className="tag-text text-accent-700 hover:underline">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('areaName', { id: 'area', header: 'Area', cell: (info) => info.getValue() ?? '—' }),
      column.accessor('location', { header: 'Location', enableSorting: false, cell: (info) => <span className="text-ink-soft">{info.getValue() ?? ''}</span> }),
      column.accessor('trapType', { header: 'Type', cell: (info) => TRAP_TYPE_LABELS[info.getValue()] }),
      column.accessor('pressureBarg', { header: 'barg', cell: (info) => info.getValue().toLocaleString('en-GB') }),
      column.accessor('sizeDn', { header: 'DN', cell: (info) => info.getValue() ?? '—' }),
      column.accessor('criticality', { header: 'Criticality', cell: (info) => CRITICALITY_LABELS[info.getValue()] }),
      column.accessor('status', {
        header: 'Status',
        cell: (info) => (
          <span className={info.getValue() === 'in_service' ? '' : 'text-ink-faint'}>{TRAP_STATUS_LABELS[info.getValue()]}</span>
        ),
      }),
    ],
    [siteId],
  );

  const sorting: SortingState = [{ id: sort, desc: dir === 'desc' }];
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    pageCount: data ? Math.max(1, Math.ceil(data.total / PAGE_SIZE)) : 1,
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      setParams({ sort: first?.id ?? null, dir: first?.desc ? 'desc' : null });
    },
    getCoreRowModel: getCoreRowModel(),
  });

  const pages = data ? Math.max(1, Math.ceil(data.total / PAGE_SIZE)) : 1;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="min-w-56 flex-1">
          <span className="field-label">Search tag or location</span>
          <input className="field-input" type="search" value={text} placeholder="e.g. FV-EVP or preheater" onChange={(e) => setText(e.target.value)} aria-label="Search tag or location" />
        </label>
        <label>
          <span className="field-label">Area</span>
          <select className="field-input" value={search.get('areaId') ?? ''} onChange={(e) => setParams({ areaId: e.target.value || null })} aria-label="Area">
            <option value="">All areas</option>
            {areas.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
          </select>
        </label>
        <label>
          <span className="field-label">Trap type</span>
          <select className="field-input" value={search.get('trapType') ?? ''} onChange={(e) => setParams({ trapType: e.target.value || null })} aria-label="Trap type">
            <option value="">All types</option>
            {TRAP_TYPES.map((t) => <option key={t} value={t}>{TRAP_TYPE_LABELS[t]}</option>)}
          </select>
        </label>
        <label>
          <span className="field-label">Status</span>
          <select className="field-input" value={search.get('status') ?? ''} onChange={(e) => setParams({ status: e.target.value || null })} aria-label="Status">
            <option value="">Any status</option>
            {TRAP_STATUSES.map((s) => <option key={s} value={s}>{TRAP_STATUS_LABELS[s]}</option>)}
          </select>
        </label>
        {canEdit && <Link href={`/sites/${siteId}/traps/new`} className="btn-primary">Add trap</Link>}
      </div>

      {error && <p role="alert" className="rounded-md border border-danger-line bg-danger-bg px-3 py-2 text-sm text-danger-ink">{error}</p>}

      <div className="panel overflow-x-auto" aria-busy={loading}>
        <table className="data-table" data-testid="trap-table">
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} aria-sort={sorted ? (sorted === 'desc' ? 'descending' : 'ascending') : undefined}>
                      {header.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 uppercase hover:text-ink" onClick={header.column.getToggleSortingHandler()}>
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true" className="text-ink-faint">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={loading ? 'opacity-60' : ''}>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="hover:bg-surface-sunken">
                {row.getVisibleCells().map((cell) => <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>)}
              </tr>
            ))}
            {data && data.items.length === 0 && (
              <tr><td colSpan={columns.length} className="py-8 text-center text-ink-soft">No trap matches these filters.</td></tr>
            )}
          </tbody>
        </table>
      </div>

      <div className="flex items-center justify-between text-sm text-ink-soft">
        <span data-testid="trap-count">{data ? `${data.total} trap${data.total === 1 ? '' : 's'}` : loading ? 'Loading…' : ''}</span>
        <div className="flex items-center gap-2">
          <button type="button" className="btn-quiet" disabled={page <= 1} onClick={() => setParams({ page: String(page - 1) })}>Previous</button>
          <span>Page {page} of {pages}</span>
          <button type="button" className="btn-quiet" disabled={page >= pages} onClick={() => setParams({ page: String(page + 1) })}>Next</button>
        </div>
      </div>
    </div>
  );
}
