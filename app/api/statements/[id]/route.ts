import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { contextOf, getStatement } from '@/lib/ledger/service';
import { statementPdf } from '@/lib/ledger/pdf';
import { payUrl } from '@/lib/ledger/statement-mail';

/** One household's statement with `paid`; `/api/statements/:id.pdf` gives the file. */
export const GET = route(async (_req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id: raw } = await params;
  const pdf = raw.endsWith('.pdf');
  const statement = await getStatement(contextOf(user), pdf ? raw.slice(0, -4) : raw);
  if (!pdf) return NextResponse.json(statement);
  const file = await statementPdf(statement, payUrl(statement.id));
  return new Response(new Uint8Array(file), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': `inline; filename="statement-${statement.id}.pdf"` },
  });
});
