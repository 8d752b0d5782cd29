/** Set by server.ts from the socket's peer address, overwriting any value a client sent. */
export const CLIENT_IP_HEADER = 'x-brixhouse-client-ip';

/** The address a request came from, as server.ts recorded it. */
export function clientIp(req: Request): string {
  return req.headers.get(CLIENT_IP_HEADER) ?? 'unknown';
}
