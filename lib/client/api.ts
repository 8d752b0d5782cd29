/** An error answer of the API, with the message and per-field messages it carried. */
export class ApiClientError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly fields: Record<string, string> = {},
    public readonly body: Record<string, unknown> = {},
    /** The API's machine-readable error code (`slot_conflict`, `invalid_input`, …), or `unreadable`. */
    public readonly code: string = typeof body.code === 'string' ? body.code : 'unknown',
  ) {
    super(message);
  }
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the caller names the answer's type
async function parse(res: Response): Promise<any> {
  const text = await res.text();
  let body: { error?: { message?: string; fields?: Record<string, string> } } | null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    // A proxy's error page, a crash before the handler: say what happened instead of a SyntaxError.
    throw new ApiClientError(
      res.status,
      res.ok ? 'Brixhouse sent an answer this page cannot read. Reload and try again.' : `The request failed (${res.status}). Try again in a moment.`,
      {},
      {},
      'unreadable',
    );
  }
  if (!res.ok) {
    const err = body?.error ?? {};
    throw new ApiClientError(res.status, err.message ?? `The request failed (${res.status}).`, err.fields ?? {}, err as Record<string, unknown>);
  }
  return body;
}

/** SWR's fetcher: GET as JSON, throwing ApiClientError on an error answer. */
export const fetcher = (url: string) => fetch(url, { headers: { accept: 'application/json' } }).then(parse);

/** A JSON write to the API. */
export function apiSend<T = unknown>(method: 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown): Promise<T> {
  return fetch(url, {
    method,
    headers: { 'content-type': 'application/json', accept: 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  }).then(parse);
}

/** Puts the API's per-field messages on the form's fields. */
export function applyFieldErrors<T extends Record<string, unknown>>(
  err: unknown,
  setError: (name: keyof T & string, e: { message: string }) => void,
  known: (keyof T & string)[],
): string | null {
  if (!(err instanceof ApiClientError)) return 'Could not reach Brixhouse. Try again in a moment.';
  let placed = false;
  for (const [k, message] of Object.entries(err.fields)) {
    if ((known as string[]).includes(k)) {
      setError(k as keyof T & string, { message });
      placed = true;
    }
  }
  return placed ? null : err.message;
}
