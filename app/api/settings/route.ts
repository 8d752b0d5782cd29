import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { getSettings, updateSettings } from '@/lib/settings';
import { SettingsInput } from '@/lib/validations/settings';

export const GET = route(async () => {
  const user = await requireRole(['coordinator']);
  return NextResponse.json(await getSettings({ cooperativeId: user.cooperativeId }));
});

export const PATCH = route(async (req) => {
  const user = await requireRole(['coordinator']);
  const input = SettingsInput.parse(await readJson(req));
  return NextResponse.json(await updateSettings({ cooperativeId: user.cooperativeId, input }));
});
