import { jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { ledgerView } from '@/lib/ledger/service';
import { LedgerFormat } from '@/lib/ledger/schema';
import { ledgerCsv } from '@/lib/ledger/csv';
import { ledgerPdf } from '@/lib/ledger/pdf';
import { getCooperative } from '@/lib/coop/service';

/** The Season ledger: JSON (default), `?format=csv` or `?format=pdf`. A member sees its own row. */
export const GET = route<{ id: string }>(async ({ ctx, params, url }) => {
  const format = LedgerFormat.parse(url.searchParams.get('format') ?? undefined);
  // Nothing was written in this request: the version read with the person may pick a kept answer.
  const { ledger, json } = await ledgerView(ctx, params.id, { knownVersion: ctx.changeVersion });
  const base = `ledger-${ledger.season.label.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}`;
  if (format === 'csv') {
    return new Response(ledgerCsv(ledger), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${base}.csv"` },
    });
  }
  if (format === 'pdf') {
    const coop = await getCooperative({ cooperativeId: ctx.cooperativeId });
    const pdf = await ledgerPdf(ledger, coop.name);
    return new Response(new Uint8Array(pdf), {
      headers: { 'content-type': 'application/pdf', 'content-disposition': `attachment; filename="${base}.pdf"` },
    });
  }
  // The JSON text is built once per change of the co-op and shared (a season's is large).
  return jsonText(json);
});
