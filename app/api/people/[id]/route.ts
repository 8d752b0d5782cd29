import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { changeRole } from '@/lib/households/service';
import { RoleChange } from '@/lib/households/schema';

export const PATCH = route<{ id: string }>(async ({ ctx, req, params }) => changeRole(ctx, params.id, await readJson(req, RoleChange)), {
  roles: ['coordinator'],
});
