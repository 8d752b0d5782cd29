/** Largest JSON body a route accepts (bytes). */
export const JSON_BODY_LIMIT = 100 * 1024;
/** Largest file the drop-off desk's upload takes, and its multipart overhead. */
export const UPLOAD_FILE_LIMIT = 10 * 1024 * 1024;
export const UPLOAD_BODY_LIMIT = UPLOAD_FILE_LIMIT + 256 * 1024;
/** Routes that take files (multipart/form-data). */
export const UPLOAD_PATHS = ['/api/uploads'];

/** The body limit of an API path. */
export function bodyLimitFor(pathname: string): number {
  return UPLOAD_PATHS.some((p) => pathname === p || pathname.startsWith(`${p}/`)) ? UPLOAD_BODY_LIMIT : JSON_BODY_LIMIT;
}

export class BodyTooLargeError extends Error {
  constructor(public readonly limit: number) {
    super(`The request body is larger than ${Math.round(limit / 1024)} kB.`);
    this.name = 'BodyTooLargeError';
  }
}

/** How much of a refused body is still read and dropped before the connection is cut. */
const DRAIN_MAX = 16 * 1024 * 1024;

/**
 * Reads and drops the rest of a refused body while the refusal is answered, so the client
 * finishes sending, reads the 413 and can use the connection again (cutting it at once makes the
 * client's next write fail before it sees the answer). A body that goes on past DRAIN_MAX is cut.
 */
async function drain(reader: ReadableStreamDefaultReader<Uint8Array>) {
  let dropped = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      dropped += value.byteLength;
      if (dropped > DRAIN_MAX) {
        await reader.cancel();
        return;
      }
    }
  } catch {
    /* the client went away */
  }
}

/**
 * Reads a request body as bytes, stopping as soon as it passes `limit`: a body sent in chunks
 * with no Content-Length is held to the same limit as one that declares its length.
 */
export async function readBodyLimited(req: Request, limit: number): Promise<Uint8Array> {
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw new BodyTooLargeError(limit);
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      void drain(reader);
      throw new BodyTooLargeError(limit);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}
