import { isCoopKey, readPhoto } from '@/lib/storage';
import { notFound } from '@/lib/server/errors';
import { route } from '@/lib/server/route';

/** A stored photo, only to signed-in people of the co-op whose key prefix it carries; never cached publicly. */
export const GET = route<{ key: string[] }>(
  async ({ ctx, params }) => {
    const key = params.key.join('/');
    if (!isCoopKey(ctx.cooperativeId, key)) throw notFound('That photo');
    const photo = await readPhoto(key);
    if (!photo) throw notFound('That photo');
    return new Response(Buffer.from(photo.body), {
      headers: {
        'content-type': photo.contentType,
        'cache-control': 'private, max-age=86400, immutable',
        'x-content-type-options': 'nosniff',
        'content-security-policy': "default-src 'none'",
      },
    });
  },
  { ids: [] },
);
