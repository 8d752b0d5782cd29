import { unstable_rethrow } from 'next/navigation';
import type { Role } from '@/lib/roles';
import { type PersonCtx, requireContext } from './context';
import { notFound } from './errors';
import { errorResponse, json } from './http';
import { guarded } from '@/lib/security/api-guard';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type Params = Record<string, string | string[] | undefined>;
type NextCtx<P> = { params: Promise<P> };

export interface RouteArgs<P> {
  req: Request;
  params: P;
  url: URL;
}
export interface AuthedArgs<P> extends RouteArgs<P> {
  ctx: PersonCtx;
}

export interface RouteOptions {
  /** Only these roles get past the wrapper (403 otherwise); finer rules live in lib/server/policies. */
  roles?: readonly Role[];
  /**
   * Path parameters that hold record ids: a malformed one answers 404 before the handler runs.
   * Default: `id` and every name ending in `Id`. Pass [] for none.
   */
  ids?: readonly string[];
}

const idNames = (params: Params, ids?: readonly string[]) => ids ?? Object.keys(params).filter((k) => k === 'id' || k.endsWith('Id'));

async function run<P extends Params, C>(
  req: Request,
  nextCtx: NextCtx<P> | undefined,
  opts: RouteOptions,
  before: () => Promise<C>,
  body: (params: P, c: C) => Promise<unknown>,
): Promise<Response> {
  let idsInPath = false;
  try {
    const c = await before(); // signed out answers 401 before a malformed id answers 404
    const params = ((await nextCtx?.params) ?? {}) as P;
    const names = idNames(params, opts.ids);
    idsInPath = names.length > 0;
    for (const n of names) {
      const v = params[n];
      if (typeof v !== 'string' || !UUID.test(v)) throw notFound();
    }
    const result = await body(params, c);
    return result instanceof Response ? result : json(result);
  } catch (err) {
    unstable_rethrow(err); // notFound(), redirect() and Next's own signals pass through
    return errorResponse(err, { idsInPath });
  }
}

/**
 * A route handler for signed-in people: refuses cross-site, mistyped and oversized writes
 * (lib/security/api-guard), builds the request context (fresh from the database),
 * checks path ids, and maps every error to the API's error body. Return a Response, or data for
 * a 200 JSON answer.
 *
 *   export const GET = route(async ({ ctx, url }) => listThings(ctx, ...));
 *   export const PATCH = route<{ id: string }>(async ({ ctx, req, params }) => changeThing(ctx, params.id, await readJson(req, Patch)));
 */
export function route<P extends Params = Params>(handler: (args: AuthedArgs<P>) => Promise<unknown>, opts: RouteOptions = {}) {
  return guarded((req: Request, nextCtx: NextCtx<P>): Promise<Response> =>
    run(
      req,
      nextCtx,
      opts,
      () => requireContext({ roles: opts.roles, req }),
      (params, ctx) => handler({ req, params, url: new URL(req.url), ctx }),
    ),
  );
}

/** A route handler open to everyone (sign-up links, health): the same error mapping, no context. */
export function publicRoute<P extends Params = Params>(handler: (args: RouteArgs<P>) => Promise<unknown>, opts: Omit<RouteOptions, 'roles'> = {}) {
  return guarded((req: Request, nextCtx: NextCtx<P>): Promise<Response> =>
    run(req, nextCtx, opts, async () => null, (params) => handler({ req, params, url: new URL(req.url) })),
  );
}
