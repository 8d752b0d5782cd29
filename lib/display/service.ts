import 'server-only';
import type { Server } from 'socket.io';
import { db } from '@/db/models';
import type { PersonCtx } from '@/lib/server/context';
import { forbidden, notFound } from '@/lib/server/errors';
import { appUrl } from '@/lib/env';
import { displayRoom, hashDisplayToken, newDisplayToken } from './tokens';
import type { DisplayLinkDto } from './types';

type Ctx = PersonCtx;

function mustCoordinate(ctx: Ctx) {
  if (ctx.actor.role !== 'coordinator') throw forbidden('Only the coordinator manages display links.');
}

export async function listDisplayLinks(ctx: Ctx): Promise<DisplayLinkDto[]> {
  mustCoordinate(ctx);
  const rows = await db().DisplayLink.findAll({ where: { cooperativeId: ctx.cooperativeId }, order: [['createdAt', 'DESC']], raw: true });
  return rows.map((r) => ({ id: r.id, name: r.name, createdAt: new Date(r.createdAt).toISOString(), revokedAt: r.revokedAt ? new Date(r.revokedAt).toISOString() : null }));
}

/** Makes a display link; the answer is the only time its address (with the token) is shown. */
export async function createDisplayLink(ctx: Ctx, { name }: { name: string }): Promise<DisplayLinkDto & { url: string }> {
  mustCoordinate(ctx);
  const token = newDisplayToken();
  const link = await db().DisplayLink.create({ cooperativeId: ctx.cooperativeId, name, tokenHash: hashDisplayToken(token), createdById: ctx.actor.userId });
  return { id: link.id, name: link.name, createdAt: link.createdAt.toISOString(), revokedAt: null, url: `${appUrl()}/display/${token}` };
}

/** Revokes a link: its page answers 404 from now on and the screens showing it are disconnected. */
export async function revokeDisplayLink(ctx: Ctx, id: string): Promise<DisplayLinkDto> {
  mustCoordinate(ctx);
  if (!/^[0-9a-f-]{36}$/i.test(id)) throw notFound('That display link');
  const link = await db().DisplayLink.findOne({ where: { id, cooperativeId: ctx.cooperativeId } });
  if (!link) throw notFound('That display link');
  if (!link.revokedAt) await link.update({ revokedAt: new Date(), revokedById: ctx.actor.userId });
  const io = (globalThis as unknown as { __brixhouseIo?: Server }).__brixhouseIo;
  // Through the adapter this reaches the screens on every server process.
  io?.in(displayRoom(link.id)).disconnectSockets(true);
  return { id: link.id, name: link.name, createdAt: link.createdAt.toISOString(), revokedAt: link.revokedAt!.toISOString() };
}
