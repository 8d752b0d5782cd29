import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getCooperative, listEvaporators, listSeasons } from '@/lib/coop/service';
import { currentSnapshot } from '@/lib/queue/service';
import { listRuns } from '@/lib/runs/service';
import { formatBrix } from '@/lib/format/units';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { DrawOffCalculator } from '@/components/sugarhouse/draw-off-calculator';
import { RunsDesk } from '@/components/runs/runs-desk';
import { BoilingCautions } from '@/components/runs/boiling-cautions';

export const metadata: Metadata = { title: 'Runs' };

export default async function RunsPage() {
  const ctx = await requireContext({ roles: ['sugarmaker', 'coordinator'], onFail: 'redirect' });
  const [coop, seasons, evaporators, cached] = await Promise.all([
    getCooperative(ctx),
    listSeasons(ctx),
    listEvaporators(ctx),
    currentSnapshot(ctx.cooperativeId),
  ]);
  const open = seasons.find((s) => s.status === 'open');
  const runs = open ? await listRuns(ctx, { seasonId: open.id }) : [];
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Runs</h1>
        <p className="text-slate-muted">
          Start a run, take sap from the queue, record each draw-off and the fuel, and finish. Syrup is finished to {formatBrix(coop.syrupBrix)}.
        </p>
      </div>
      <BoilingCautions />
      <div className="grid gap-6 xl:grid-cols-[2fr_1fr]">
        <RunsDesk
          initialRuns={runs}
          initialQueue={cached!.snapshot}
          evaporators={evaporators}
          unitSystem={coop.unitSystem}
          timeZone={coop.timeZone}
          currency={coop.currency}
          fuelPriceCents={open?.fuelPriceCents ?? 0}
          seasonOpen={!!open}
        />
        <Card className="self-start">
          <CardHeader>
            <CardTitle>Draw-off target</CardTitle>
          </CardHeader>
          <CardBody>
            <p className="text-sm">
              The temperature at which syrup of the co-op’s finishing density boils at the sugarhouse’s elevation, or at today’s barometer
              reading. Confirm every draw-off with a hydrometer (hot-test corrected) or a refractometer.
            </p>
            <DrawOffCalculator elevationM={coop.elevationM} finishBrix={coop.syrupBrix} unitSystem={coop.unitSystem} />
          </CardBody>
        </Card>
      </div>
    </div>
  );
}
