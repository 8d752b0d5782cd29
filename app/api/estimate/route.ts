import { ZodError } from 'zod';
import { badRequest } from '@/lib/server/errors';
import { fieldErrors, readQuery } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { boilHours, sapToSyrupRatio, sugarKg, syrupLitres, waterToEvaporateL } from '@/lib/sugar';
import { EstimateQuery } from '@/lib/estimate/schema';
import { getCooperative, listEvaporators } from '@/lib/coop/service';

/** Live preview for the drop-off form: the sugar in a lot and the syrup and boiling it means. */
export const GET = route(async ({ ctx, req }) => {
  let q;
  try {
    q = readQuery(req, EstimateQuery);
  } catch (err) {
    if (err instanceof ZodError) throw badRequest('Check the volume and °Brix.', 'invalid_input', { fields: fieldErrors(err) });
    throw err;
  }
  const [coop, evaporators] = await Promise.all([getCooperative(ctx), listEvaporators(ctx)]);
  const { volumeL, brix } = q;
  const syrupBrix = q.syrupBrix ?? coop.syrupBrix;
  try {
    return {
      sugarKg: sugarKg(volumeL, brix),
      syrupL: syrupLitres(volumeL, brix, syrupBrix),
      waterL: waterToEvaporateL(volumeL, brix, syrupBrix),
      boilHours: evaporators[0] ? boilHours(volumeL, brix, evaporators[0].evaporationLph, syrupBrix) : null,
      ratio: sapToSyrupRatio(brix, { rule: 'mass-balance', syrupBrix }),
    };
  } catch (err) {
    if (err instanceof RangeError) throw badRequest(err.message, 'out_of_range');
    throw err;
  }
});
