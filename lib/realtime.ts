import type { Server } from 'socket.io';

const globalForIo = globalThis as unknown as { __brixhouseIo?: Server };

/** Called once by server.ts; route handlers reach the same socket.io server through it. */
export function setRealtimeServer(io: Server) {
  globalForIo.__brixhouseIo = io;
}

/** The room every signed-in screen of one cooperative joins. */
export const coopRoom = (cooperativeId: string) => `coop:${cooperativeId}`;
/** The room of one person's open sockets (every tab, every device). */
export const personRoom = (userId: string) => `person:${userId}`;

/** Tells every screen of a cooperative that something changed; a no-op outside the server. */
export function broadcast(cooperativeId: string, event: string, payload: unknown) {
  globalForIo.__brixhouseIo?.to(coopRoom(cooperativeId)).emit(event, payload);
}

/**
 * Closes a person's open sockets on every server process (through the adapter), after their
 * role, household or sessions changed; their screens reconnect and are checked afresh.
 */
export function disconnectPerson(userId: string) {
  globalForIo.__brixhouseIo?.in(personRoom(userId)).disconnectSockets(true);
}
