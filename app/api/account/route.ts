import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { ChangeNameInput } from '@/lib/account/schema';
import { changeName } from '@/lib/account/service';

/** Changes the signed-in person's name. */
export const PATCH = route(async ({ ctx, req }) => changeName(ctx, await readJson(req, ChangeNameInput)));
