import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';

/** The stored form of a display token: SHA-256, hex. The token itself is never stored. */
export const hashDisplayToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** A new unguessable token (192 random bits, URL-safe). */
export const newDisplayToken = () => randomBytes(24).toString('base64url');

export interface DisplayLinkRef {
  id: string;
  cooperativeId: string;
  name: string;
}

/** The live (not revoked) display link a token opens, or null. */
export async function findDisplayLink(token: unknown): Promise<DisplayLinkRef | null> {
  if (typeof token !== 'string' || !/^[A-Za-z0-9_-]{20,100}$/.test(token)) return null;
  const rows = await getSequelize().query<DisplayLinkRef>(
    `SELECT id, cooperative_id AS "cooperativeId", name FROM display_links WHERE token_hash = :hash AND revoked_at IS NULL`,
    { replacements: { hash: hashDisplayToken(token) }, type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

/** The socket.io room of one display link's screens, so revoking it can close them. */
export const displayRoom = (displayLinkId: string) => `display:${displayLinkId}`;
