import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { getSettings, updateSettings } from '@/lib/settings/service';
import { SettingsInput } from '@/lib/settings/schema';

export const GET = route(async ({ ctx }) => getSettings(ctx), { roles: ['coordinator'] });

export const PATCH = route(async ({ ctx, req }) => updateSettings(ctx, await readJson(req, SettingsInput)), { roles: ['coordinator'] });
