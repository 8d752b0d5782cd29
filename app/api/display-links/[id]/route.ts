import { route } from '@/lib/server/route';
import { revokeDisplayLink } from '@/lib/display/service';

/** Revokes the link (it stays listed as revoked). */
export const DELETE = route<{ id: string }>(async ({ ctx, params }) => revokeDisplayLink(ctx, params.id), { roles: ['coordinator'] });
