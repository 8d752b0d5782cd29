import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getCooperative, listEvaporators } from '@/lib/coop/service';
import { GRADE_CLASSES, GRADE_CLASS_INFO, standardPressureKPa } from '@/lib/sugar';
import { formatBrix } from '@/lib/format/units';
import { showRate } from '@/lib/figures';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { DrawOffCalculator } from '@/components/sugarhouse/draw-off-calculator';

export const metadata: Metadata = { title: 'Sugarhouse' };

export default async function SugarhousePage() {
  const ctx = await requireContext({ roles: ['sugarmaker', 'coordinator'], onFail: 'redirect' });
  const [coop, evaporators] = await Promise.all([
    getCooperative(ctx),
    listEvaporators(ctx),
  ]);
  const units = coop.unitSystem;
  const elevation = units === 'us' ? `${Math.round(coop.elevationM / 0.3048).toLocaleString('en-US')} ft` : `${coop.elevationM} m`;
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Sugarhouse</h1>
        <p className="text-slate-muted">
          {coop.name} · elevation {elevation} · standard pressure {standardPressureKPa(coop.elevationM).toFixed(1)} kPa · syrup finished to{' '}
          {formatBrix(coop.syrupBrix)}
        </p>
      </div>
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader>
            <CardTitle>Draw-off temperature</CardTitle>
          </CardHeader>
          <CardBody className="flex flex-col gap-4">
            <p>
              Syrup is finished at the co-op’s density, {formatBrix(coop.syrupBrix)}. It boils above water by the boiling-point elevation of a
              sucrose solution of that density (Starzak &amp; Peacock, Zuckerindustrie, 1997), close to the trade’s “about{' '}
              {units === 'us' ? '7 °F' : '4 °C'} above water” shortcut. Confirm every draw-off with a hydrometer or refractometer.
            </p>
            <DrawOffCalculator elevationM={coop.elevationM} finishBrix={coop.syrupBrix} unitSystem={units} />
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>Evaporators</CardTitle>
          </CardHeader>
          <CardBody>
            <Table label="Evaporators" stack>
              <THead>
                <TR>
                  <TH>Name</TH>
                  <TH numeric>Rated evaporation</TH>
                  <TH>Fuel</TH>
                </TR>
              </THead>
              <TBody>
                {evaporators.map((e) => (
                  <TR key={e.id}>
                    <TH scope="row">{e.name}</TH>
                    <TD label="Rated evaporation" numeric>{showRate(e.evaporationLph, units)} of water</TD>
                    <TD label="Fuel">{e.fuelKind}</TD>
                  </TR>
                ))}
              </TBody>
            </Table>
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>Grade A colour classes</CardTitle>
          </CardHeader>
          <CardBody>
            <p className="mb-3 text-slate-muted">Light transmittance at 560 nm against glycerol (USDA grade standard, 2015).</p>
            <ul className="flex flex-col gap-2">
              {GRADE_CLASSES.map((g) => (
                <li key={g} className="flex flex-wrap items-center gap-2">
                  <Badge variant={g}>{GRADE_CLASS_INFO[g].name}</Badge>
                  <span>{GRADE_CLASS_INFO[g].taste}</span>
                  <span className="text-slate-muted">{GRADE_CLASS_INFO[g].rangeText}</span>
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
        <Alert tone="warning" title="Safety at the evaporator">
          <ul className="list-disc pl-5">
            <li>Boiling sap and syrup cause deep burns: wear gloves, keep children and visitors back from the pans.</li>
            <li>Never leave a firing evaporator unattended; keep stack clearances and a fire extinguisher at hand.</li>
            <li>Carbon monoxide builds up in closed sugarhouses: ventilate and keep a CO alarm working.</li>
            <li>Use lead-free pans, fittings and solder.</li>
            <li>Syrup sold to the public must meet your state or province’s licensing, food-safety and labelling rules.</li>
          </ul>
          <p className="mt-2">Follow local fire and building codes and licensed practice; this page does not replace them.</p>
        </Alert>
      </div>
    </div>
  );
}
