import 'server-only';
import { db } from '@/db/models';
import { ApiError } from '@/lib/api/errors';
import type { SettingsInput } from '@/lib/validations/settings';

export type SettingsDto = SettingsInput;

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

export async function getSettings({ cooperativeId }: { cooperativeId: string }): Promise<SettingsDto> {
  const coop = await db().Cooperative.findByPk(cooperativeId);
  if (!coop) throw new ApiError(404, 'Your cooperative was not found.');
  return pick(coop);
}

export async function updateSettings({ cooperativeId, input }: { cooperativeId: string; input: SettingsInput }): Promise<SettingsDto> {
  const { Cooperative, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const coop = await Cooperative.findByPk(cooperativeId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!coop) throw new ApiError(404, 'Your cooperative was not found.');
    await coop.update(input, { transaction });
    return pick(coop);
  });
}
