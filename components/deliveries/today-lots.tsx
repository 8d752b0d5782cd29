import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { buttonVariants } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import type { DeliveryDto } from '@/lib/deliveries/types';
import type { UnitSystem } from '@/lib/sugar';
import { brix, formatWhen, mass, vol } from './format';

/** Accepted lots' count, volume, sugar and volume-weighted °Brix; rejected lots counted apart. */
export function lotTotals(lots: DeliveryDto[]) {
  const accepted = lots.filter((l) => l.status === 'accepted');
  const litres = accepted.reduce((s, l) => s + l.volumeL, 0);
  return {
    accepted: accepted.length,
    rejected: lots.length - accepted.length,
    litres,
    sugarKg: accepted.reduce((s, l) => s + l.sugarKg, 0),
    meanBrix: litres > 0 ? accepted.reduce((s, l) => s + l.volumeL * l.brix, 0) / litres : null,
  };
}

interface TodayLotsProps {
  title: string;
  lots: DeliveryDto[];
  units: UnitSystem;
  timeZone: string;
  /** Show whose lot each is (staff); a member's card shows its own only. */
  showHousehold: boolean;
  empty: string;
  totalsLabel: string;
  totals: ReturnType<typeof lotTotals>;
  linkLabel: string;
}

/** The Today page's card of drop-offs: a few lots and their totals, server-rendered. */
export function TodayLots({ title, lots, units, timeZone, showHousehold, empty, totalsLabel, totals, linkLabel }: TodayLotsProps) {
  return (
    <Card>
      <CardHeader>
        <CardTitle>{title}</CardTitle>
      </CardHeader>
      <CardBody>
        <p data-testid="today-lot-totals">
          <span className="font-semibold">{totalsLabel}:</span>{' '}
          <span className="num">
            {totals.accepted} accepted {totals.accepted === 1 ? 'lot' : 'lots'}, {vol(totals.litres, units)}, {mass(totals.sugarKg, units)} of sugar
            {totals.meanBrix !== null ? `, ${brix(totals.meanBrix)} on average` : ''}
          </span>
          {totals.rejected ? <span className="text-slate-muted"> ({totals.rejected} rejected, not counted)</span> : null}
        </p>
        {lots.length === 0 ? (
          <p className="text-slate-muted">{empty}</p>
        ) : (
          <ul className="flex flex-col gap-2">
            {lots.map((l) => (
              <li key={l.id} className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-birch-line p-3">
                <span>
                  {showHousehold ? <span className="font-semibold">{l.householdName} </span> : null}
                  <span className="num">
                    {vol(l.volumeL, units)} at {brix(l.brix)}
                  </span>
                  <span className="block text-sm text-slate-muted">{formatWhen(l.receivedAt, timeZone)}</span>
                </span>
                <Badge variant={l.status === 'accepted' ? 'spruce' : 'ember'}>{l.status === 'accepted' ? 'Accepted' : 'Rejected'}</Badge>
              </li>
            ))}
          </ul>
        )}
        <Link href="/deliveries" className={buttonVariants({ variant: 'secondary' })}>
          {linkLabel}
        </Link>
      </CardBody>
    </Card>
  );
}
