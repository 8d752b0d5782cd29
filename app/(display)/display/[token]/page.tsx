import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getCooperative } from '@/lib/coop/service';
import { findDisplayLink } from '@/lib/display/tokens';
import { currentSnapshot } from '@/lib/queue/service';
import { DisplayBoard } from '@/components/display/display-board';

export const metadata: Metadata = { title: 'Sugarhouse display' };
export const dynamic = 'force-dynamic';

/** The read-only sugarhouse screen a display link opens; a revoked or unknown token is a 404. */
export default async function DisplayPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = await findDisplayLink(token);
  if (!link) notFound();
  const [coop, cached] = await Promise.all([getCooperative({ cooperativeId: link.cooperativeId }), currentSnapshot(link.cooperativeId)]);
  return <DisplayBoard token={token} initial={cached!.snapshot} coopName={coop.name} unitSystem={coop.unitSystem} timeZone={coop.timeZone} />;
}
