import { requireUser } from '@/lib/auth/session';
import { ApiError, route } from '@/lib/api/errors';
import { isCoopKey, readPhoto } from '@/lib/storage';

type Ctx = { params: Promise<{ key: string[] }> };

/** A stored photo, only to signed-in people of the co-op whose key prefix it carries. */
export const GET = route<Ctx>(async (_req, { params }) => {
  const user = await requireUser();
  const key = (await params).key.join('/');
  const notFound = () => new ApiError(404, 'That photo was not found.', undefined, { code: 'not_found' });
  if (!isCoopKey(user.cooperativeId, key)) throw notFound();
  const photo = await readPhoto(key);
  if (!photo) throw notFound();
  return new Response(Buffer.from(photo.body), {
    headers: {
      'content-type': photo.contentType,
      'cache-control': 'private, max-age=86400, immutable',
      'x-content-type-options': 'nosniff',
      'content-security-policy': "default-src 'none'",
    },
  });
});
