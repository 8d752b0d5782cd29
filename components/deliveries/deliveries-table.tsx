'use client';

import { useMemo, useState } from 'react';
import dynamic from 'next/dynamic';
import useSWR from 'swr';
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type RowData, type SortingState } from '@tanstack/react-table';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Input, Label } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { fetcher } from '@/lib/client/api';
import type { DeliveryDto } from '@/lib/deliveries/types';
import { kgToPounds, type UnitSystem } from '@/lib/sugar';
import { brix as fmtBrix, formatWhen, mass, massUnit, vol, volumeNumber, volumeUnit } from './format';

// The lot's details dialog (its form for corrections, the dialog's focus handling) loads the first
// time a lot is opened, not with the page.
const DeliveryDetails = dynamic(() => import('./delivery-details').then((m) => m.DeliveryDetails), { ssr: false });

export interface DeliveriesTableProps {
  units: UnitSystem;
  timeZone: string;
  seasonId: string | null;
  /** Staff see every household and may filter by one; a member sees its own. */
  households: { id: string; name: string }[] | null;
  canCorrect: boolean;
  initial: DeliveryDto[];
  /** File name stem of the CSV export. */
  exportName: string;
}

export interface Filters {
  householdId: string;
  status: '' | 'accepted' | 'rejected';
  day: string;
}

/** The API address the filters stand for; the server page renders the same one first. */
export function deliveriesUrl(seasonId: string | null, f: Filters): string {
  const q = new URLSearchParams();
  if (seasonId) q.set('seasonId', seasonId);
  if (f.householdId) q.set('householdId', f.householdId);
  if (f.status) q.set('status', f.status);
  if (f.day) {
    q.set('from', f.day);
    q.set('to', f.day);
  }
  return `/api/deliveries?${q.toString()}`;
}

const col = createColumnHelper<DeliveryDto>();
/** Rows drawn at first and added by “Show more”; totals and the CSV cover every lot the filters select. */
const PAGE = 30;

export function DeliveriesTable({ units, timeZone, seasonId, households, canCorrect, initial, exportName }: DeliveriesTableProps) {
  const [filters, setFilters] = useState<Filters>({ householdId: '', status: '', day: '' });
  const [sorting, setSorting] = useState<SortingState>([]);
  const [openId, setOpenId] = useState<string | null>(null);
  // Kept once opened, so the dialog can close and hand focus back.
  const [detailsWanted, setDetailsWanted] = useState(false);
  const [limit, setLimit] = useState(PAGE);
  const url = deliveriesUrl(seasonId, filters);
  const first = deliveriesUrl(seasonId, { householdId: '', status: '', day: '' });
  const { data, error, isLoading } = useSWR<DeliveryDto[]>(url, fetcher, {
    fallbackData: url === first ? initial : undefined,
    keepPreviousData: true,
    revalidateOnFocus: false,
  });
  const lots = useMemo(() => data ?? [], [data]);

  const columns = useMemo(
    () => [
      col.accessor('receivedAt', {
        header: 'Received',
        cell: (c) => <span className="whitespace-nowrap">{formatWhen(c.getValue(), timeZone)}</span>,
      }),
      ...(households ? [col.accessor('householdName', { header: 'Household' })] : []),
      col.accessor('volumeL', { header: `Volume (${volumeUnit(units)})`, cell: (c) => vol(c.getValue(), units), meta: { numeric: true } }),
      col.accessor('brix', { header: '°Brix', cell: (c) => fmtBrix(c.getValue()), meta: { numeric: true } }),
      col.accessor('sugarKg', {
        header: `Sugar (${massUnit(units)})`,
        cell: (c) => (c.row.original.status === 'accepted' ? mass(c.getValue(), units) : <span className="text-slate-muted">not counted</span>),
        meta: { numeric: true },
      }),
      col.accessor('status', {
        header: 'Status',
        cell: (c) => (
          <span className="flex flex-col items-start gap-1">
            <Badge variant={c.getValue() === 'accepted' ? 'spruce' : 'ember'}>{c.getValue() === 'accepted' ? 'Accepted' : 'Rejected'}</Badge>
            {c.row.original.status === 'rejected' && c.row.original.reason ? (
              <span className="line-clamp-2 max-w-[16rem] text-sm text-slate-muted">{c.row.original.reason}</span>
            ) : null}
            {c.row.original.revisions > 0 ? <span className="text-sm text-slate-muted">corrected</span> : null}
          </span>
        ),
      }),
      col.display({
        id: 'open',
        header: () => <span className="sr-only">Details</span>,
        cell: (c) => (
          <Button
            variant="ghost"
            size="sm"
            onClick={() => {
              setDetailsWanted(true);
              setOpenId(c.row.original.id);
            }}
            aria-label={`Details of the lot received ${formatWhen(c.row.original.receivedAt, timeZone)}`}
          >
            Details
          </Button>
        ),
      }),
    ],
    [households, timeZone, units],
  );

  const table = useReactTable({
    data: lots,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (r) => r.id,
  });
  const allRows = table.getRowModel().rows;
  const shown = allRows.map((r) => r.original);
  const drawn = allRows.slice(0, limit);
  const totals = useMemo(() => {
    const accepted = shown.filter((l) => l.status === 'accepted');
    const litres = accepted.reduce((s, l) => s + l.volumeL, 0);
    const sugar = accepted.reduce((s, l) => s + l.sugarKg, 0);
    const brixSum = accepted.reduce((s, l) => s + l.volumeL * l.brix, 0);
    return { lots: shown.length, rejected: shown.length - accepted.length, litres, sugar, meanBrix: litres > 0 ? brixSum / litres : null };
  }, [shown]);

  async function exportCsv() {
    const { unparse } = await import('papaparse');
    const vu = volumeUnit(units);
    const mu = massUnit(units);
    const csv = unparse(
      shown.map((l) => ({
        'Lot id': l.id,
        Received: l.receivedAt,
        'Collected on': l.collectedOn,
        Household: l.householdName,
        [`Volume (${vu})`]: volumeNumber(l.volumeL, units).toFixed(units === 'us' ? 3 : 1),
        'Volume (L)': l.volumeL,
        '°Brix': l.brix.toFixed(1),
        [`Sugar (${mu})`]: l.status === 'accepted' ? (units === 'us' ? kgToPounds(l.sugarKg) : l.sugarKg).toFixed(3) : '',
        'Sap temperature (°C)': l.sapTempC,
        Clarity: l.clarity,
        'In the sap': l.contamination,
        Status: l.status,
        Reason: l.reason ?? '',
        'Logged by': l.loggedByName ?? '',
        Note: l.note ?? '',
      })),
    );
    const blob = new Blob([`\ufeff${csv}\r\n`], { type: 'text/csv;charset=utf-8' });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `${exportName}${filters.day ? `-${filters.day}` : ''}.csv`;
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(a.href), 10_000);
  }

  const set = (patch: Partial<Filters>) => {
    setFilters((f) => ({ ...f, ...patch }));
    setLimit(PAGE);
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-3" role="group" aria-label="Filters">
        {households ? (
          <div className="flex min-w-40 flex-col gap-1.5">
            <Label htmlFor="filter-household">Household</Label>
            <Select id="filter-household" value={filters.householdId} onChange={(e) => set({ householdId: e.target.value })}>
              <option value="">All households</option>
              {households.map((h) => (
                <option key={h.id} value={h.id}>
                  {h.name}
                </option>
              ))}
            </Select>
          </div>
        ) : null}
        <div className="flex min-w-36 flex-col gap-1.5">
          <Label htmlFor="filter-status">Status</Label>
          <Select id="filter-status" value={filters.status} onChange={(e) => set({ status: e.target.value as Filters['status'] })}>
            <option value="">Accepted and rejected</option>
            <option value="accepted">Accepted</option>
            <option value="rejected">Rejected</option>
          </Select>
        </div>
        <div className="flex flex-col gap-1.5">
          <Label htmlFor="filter-day">Day</Label>
          <Input id="filter-day" type="date" value={filters.day} onChange={(e) => set({ day: e.target.value })} className="w-44" />
        </div>
        {filters.householdId || filters.status || filters.day ? (
          <Button variant="ghost" onClick={() => setFilters({ householdId: '', status: '', day: '' })}>
            Clear filters
          </Button>
        ) : null}
        <Button variant="secondary" className="ml-auto" onClick={exportCsv} disabled={!shown.length}>
          Download CSV
        </Button>
      </div>

      {error ? <p role="alert" className="font-semibold text-ember">The drop-offs could not be loaded: {String(error.message ?? error)}</p> : null}

      <Table label="Drop-offs" stack aria-busy={isLoading || undefined} data-testid="deliveries-table">
        <THead>
          {table.getHeaderGroups().map((hg) => (
            <TR key={hg.id}>
              {hg.headers.map((h) => {
                const numeric = (h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                const sort = h.column.getIsSorted();
                return (
                  <TH key={h.id} numeric={numeric} aria-sort={sort === 'asc' ? 'ascending' : sort === 'desc' ? 'descending' : undefined}>
                    {h.column.getCanSort() && h.column.id !== 'open' ? (
                      <button type="button" className="min-h-touch font-semibold" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        {sort ? <span aria-hidden="true">{sort === 'asc' ? ' ↑' : ' ↓'}</span> : null}
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </TH>
                );
              })}
            </TR>
          ))}
        </THead>
        <TBody>
          {drawn.length === 0 ? (
            <TR>
              <TD colSpan={columns.length} className="text-slate-muted">
                No drop-offs match these filters.
              </TD>
            </TR>
          ) : (
            drawn.map((row) => (
              <TR key={row.id} data-testid="lot-row" data-lot-id={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <TD
                    key={cell.id}
                    numeric={(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric}
                    label={typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : undefined}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </TD>
                ))}
              </TR>
            ))
          )}
        </TBody>
        <tfoot className="border-t-2 border-birch-edge bg-birch font-semibold" data-testid="lot-totals">
          <TR>
            <TH scope="row" className="text-sm">
              {totals.lots} {totals.lots === 1 ? 'lot' : 'lots'}
              {totals.rejected ? <span className="block font-normal text-slate-muted">{totals.rejected} rejected, not counted</span> : null}
            </TH>
            {households ? <TD /> : null}
            <TD numeric label={`Volume (${volumeUnit(units)})`} data-testid="total-volume">{vol(totals.litres, units)}</TD>
            <TD numeric label="Mean °Brix" data-testid="total-brix">{totals.meanBrix === null ? '—' : fmtBrix(totals.meanBrix)}</TD>
            <TD numeric label={`Sugar (${massUnit(units)})`} data-testid="total-sugar">{mass(totals.sugar, units)}</TD>
            <TD colSpan={2} className="text-sm font-normal text-slate-muted">
              Accepted lots; °Brix weighted by volume
            </TD>
          </TR>
        </tfoot>
      </Table>

      {allRows.length > drawn.length ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" onClick={() => setLimit((n) => n + PAGE)}>
            Show more lots
          </Button>
          <span className="text-slate-muted">
            Showing {drawn.length} of {allRows.length}; the totals and the CSV cover all {allRows.length}.
          </span>
        </div>
      ) : null}

      {detailsWanted ? (
        <DeliveryDetails id={openId} onClose={() => setOpenId(null)} units={units} timeZone={timeZone} households={households} canCorrect={canCorrect} />
      ) : null}
    </div>
  );
}

declare module '@tanstack/react-table' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- the generic parameters are the library's
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Right-aligns the column's figures. */
    numeric?: boolean;
  }
}
