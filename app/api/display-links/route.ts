import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { createDisplayLink, listDisplayLinks } from '@/lib/display/service';
import { DisplayLinkInput } from '@/lib/display/schema';

export const GET = route(async ({ ctx }) => listDisplayLinks(ctx), { roles: ['coordinator'] });

export const POST = route(async ({ ctx, req }) => json(await createDisplayLink(ctx, await readJson(req, DisplayLinkInput)), 201), {
  roles: ['coordinator'],
});
