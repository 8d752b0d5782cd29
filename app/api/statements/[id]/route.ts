import { route } from '@/lib/server/route';
import { getStatement } from '@/lib/ledger/service';
import { statementPdf } from '@/lib/ledger/pdf';
import { payUrl } from '@/lib/ledger/statement-mail';

/** One household's statement with `paid`; `/api/statements/:id.pdf` gives the file. */
export const GET = route<{ id: string }>(
  async ({ ctx, params }) => {
    const pdf = params.id.endsWith('.pdf');
    const statement = await getStatement(ctx, pdf ? params.id.slice(0, -4) : params.id);
    if (!pdf) return statement;
    const file = await statementPdf(statement, payUrl(statement.id));
    return new Response(new Uint8Array(file), {
      headers: { 'content-type': 'application/pdf', 'content-disposition': `inline; filename="statement-${statement.id}.pdf"` },
    });
  },
  // The id may end in ".pdf": getStatement answers 404 for anything else that is not an id.
  { ids: [] },
);
