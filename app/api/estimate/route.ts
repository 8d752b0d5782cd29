import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { ApiError, route } from '@/lib/api/errors';
import { boilHours, sapToSyrupRatio, sugarKg, syrupLitres, waterToEvaporateL } from '@/lib/sugar';
import { EstimateQuery } from '@/lib/validations/estimate';
import { getCooperative, listEvaporators } from '@/lib/coop';

/** Live preview for the drop-off form: the sugar in a lot and the syrup and boiling it means. */
export const GET = route(async (req) => {
  const user = await requireUser();
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const parsed = EstimateQuery.safeParse(params);
  if (!parsed.success) {
    const fields = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]));
    throw new ApiError(400, 'Check the volume and °Brix.', fields);
  }
  const [coop, evaporators] = await Promise.all([
    getCooperative({ cooperativeId: user.cooperativeId }),
    listEvaporators({ cooperativeId: user.cooperativeId }),
  ]);
  const { volumeL, brix } = parsed.data;
  const syrupBrix = parsed.data.syrupBrix ?? coop.syrupBrix;
  try {
    return NextResponse.json({
      sugarKg: sugarKg(volumeL, brix),
      syrupL: syrupLitres(volumeL, brix, syrupBrix),
      waterL: waterToEvaporateL(volumeL, brix, syrupBrix),
      boilHours: evaporators[0] ? boilHours(volumeL, brix, evaporators[0].evaporationLph, syrupBrix) : null,
      ratio: sapToSyrupRatio(brix, { rule: 'mass-balance', syrupBrix }),
    });
  } catch (err) {
    if (err instanceof RangeError) throw new ApiError(400, err.message);
    throw err;
  }
});
