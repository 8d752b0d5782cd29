import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { clock } from '@/components/queue/format';
import type { RunDto } from '@/lib/runs/types';
import { GRADE_CLASS_INFO, type GradeClass, type UnitSystem } from '@/lib/sugar';
import { formatBrix, formatMoney } from '@/lib/format/units';
import { showSyrup, showVolume } from '@/lib/figures';

interface FinishedRunsProps {
  runs: RunDto[];
  unitSystem: UnitSystem;
  timeZone: string;
  currency: string;
}

/** Finished runs with their lot code, the sap that went in, the syrup drawn off by colour class, and the fuel. */
export function FinishedRuns({ runs, unitSystem, timeZone, currency }: FinishedRunsProps) {
  return (
    <Card>
      <CardHeader>
        <CardTitle>Finished runs this season</CardTitle>
      </CardHeader>
      <CardBody>
        {runs.length === 0 ? <p className="text-slate-muted">No run has finished yet this season.</p> : null}
        <ul className="flex flex-col gap-3" aria-label="Finished runs">
          {runs.map((r) => {
            const byClass = new Map<GradeClass, number>();
            for (const d of r.draws) byClass.set(d.gradeClass, (byClass.get(d.gradeClass) ?? 0) + d.litres);
            return (
              <li key={r.id} data-testid="finished-run" className="rounded-lg border border-birch-line p-3">
                <details>
                  <summary className="flex min-h-touch cursor-pointer flex-wrap items-center gap-x-3 gap-y-1">
                    <span className="text-lg font-bold">Lot {r.lotCode}</span>
                    <span className="text-slate-muted">
                      {clock(r.startedAt, timeZone)}–{r.finishedAt ? clock(r.finishedAt, timeZone, false) : ''}
                    </span>
                    <span>
                      {showVolume(r.totals.inputL, unitSystem)} sap → {showSyrup(r.totals.syrupDrawnL, unitSystem)} syrup
                    </span>
                    <span className="flex flex-wrap gap-1">
                      {[...byClass].map(([k, l]) => (
                        <Badge key={k} variant={k}>
                          {GRADE_CLASS_INFO[k].name} {showSyrup(l, unitSystem)}
                        </Badge>
                      ))}
                    </span>
                  </summary>
                  <div className="mt-3 grid gap-3 text-sm md:grid-cols-3">
                    <div>
                      <h3 className="font-bold">Sap in</h3>
                      <ul>
                        {r.inputs.map((i) => (
                          <li key={i.id}>
                            {i.householdName}: {showVolume(i.litres, unitSystem)} at {formatBrix(i.brix)}
                          </li>
                        ))}
                      </ul>
                    </div>
                    <div>
                      <h3 className="font-bold">Draw-offs</h3>
                      <ul>
                        {r.draws.map((d) => (
                          <li key={d.id}>
                            {clock(d.drawnAt, timeZone, false)}: {showSyrup(d.litres, unitSystem)} at {formatBrix(d.brix)}
                            {d.transmittancePct !== null ? `, ${d.transmittancePct} %Tc` : ''} ({GRADE_CLASS_INFO[d.gradeClass].name})
                          </li>
                        ))}
                      </ul>
                    </div>
                    <div>
                      <h3 className="font-bold">Fuel</h3>
                      <ul>
                        {r.fuel.map((f) => (
                          <li key={f.id}>
                            {f.quantity} {f.unit === 'cord' ? 'cord' : 'L'} {f.kind}: {formatMoney(f.costCents, currency)}
                          </li>
                        ))}
                      </ul>
                    </div>
                  </div>
                </details>
              </li>
            );
          })}
        </ul>
      </CardBody>
    </Card>
  );
}
