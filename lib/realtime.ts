import type { Server } from 'socket.io';

const globalForIo = globalThis as unknown as { __brixhouseIo?: Server };

/** Called once by server.ts; route handlers reach the same socket.io server through it. */
export function setRealtimeServer(io: Server) {
  globalForIo.__brixhouseIo = io;
}

/** The room every signed-in screen of one cooperative joins. */
export const coopRoom = (cooperativeId: string) => `coop:${cooperativeId}`;

/** Tells every screen of a cooperative that something changed; a no-op outside the server. */
export function broadcast(cooperativeId: string, event: string, payload: unknown) {
  globalForIo.__brixhouseIo?.to(coopRoom(cooperativeId)).emit(event, payload);
}
