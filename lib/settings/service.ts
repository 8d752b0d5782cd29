import 'server-only';
import { db } from '@/db/models';
import { recordChange } from '@/lib/events';
import type { Ctx } from '@/lib/server/context';
import { notFound } from '@/lib/server/errors';
import { authorize } from '@/lib/server/policies';
import { withTransaction } from '@/lib/server/tx';
import type { SettingsInput } from '@/lib/settings/schema';
import type { SettingsDto } from './types';
export type { SettingsDto };


const pick = (c: import('@/db/models').Cooperative): SettingsDto => ({
  opensAt: c.opensAt.slice(0, 5),
  closesAt: c.closesAt.slice(0, 5),
  slotMinMinutes: c.slotMinMinutes,
  slotMaxMinutes: c.slotMaxMinutes,
  cancelNoticeHours: c.cancelNoticeHours,
  syrupBrix: c.syrupBrix,
  shelfDays: c.shelfDays,
  warmAboveC: c.warmAboveC,
  warmShelfDays: c.warmShelfDays,
});

export async function getSettings(ctx: Ctx): Promise<SettingsDto> {
  authorize(ctx.actor, 'settings.read');
  const coop = await db().Cooperative.findByPk(ctx.cooperativeId, { transaction: ctx.transaction });
  if (!coop) throw notFound('Your cooperative');
  return pick(coop);
}

export async function updateSettings(ctx: Ctx, input: SettingsInput): Promise<SettingsDto> {
  authorize(ctx.actor, 'settings.update');
  const { Cooperative } = db();
  return withTransaction(ctx, async ({ cooperativeId, transaction }) => {
    const coop = await Cooperative.findByPk(cooperativeId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!coop) throw notFound('Your cooperative');
    await coop.update(input, { transaction });
    // The queue's spoil flags and the draw-off target follow these settings: tell the screens.
    await recordChange({ cooperativeId, transaction }, { type: 'settings.changed' });
    return pick(coop);
  });
}
