import { notFound } from '@/lib/server/errors';
import { publicRoute } from '@/lib/server/route';

/**
 * Any address under /api that no route answers: a JSON 404 with the API's headers, not the HTML
 * "page not found" (an API client cannot read that, and pages get their CSP from proxy.ts, which
 * the API skips).
 */
const none = publicRoute(async () => {
  throw notFound('That API address', 'no_such_route');
});

export { none as GET, none as POST, none as PUT, none as PATCH, none as DELETE };
