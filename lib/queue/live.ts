// Runs in server.ts (plain Node): no 'server-only' marker.
import type { Server, Socket } from 'socket.io';
import { getLiveSequelize } from '@/db';
import { onChange } from '@/lib/events';
import { coopRoom } from '@/lib/realtime';
import { computeSnapshot, currentSnapshot, rememberSnapshot } from './service';

/**
 * A lone change is sent at once (on the next turn of the event loop, so the changes of one turn
 * make one snapshot). Snapshots of one co-op start at least this far apart: the changes of a
 * burst that arrive meanwhile, or while a snapshot is being read, make one more snapshot after
 * the gap, so a busy desk costs at most 25 snapshots a second however many lots it logs.
 */
const MIN_GAP_MS = 40;

/** What a process tells the others when a change to a co-op's queue committed on it. */
const PEER_EVENT = 'queue:changed';

interface Pending {
  timer: ReturnType<typeof setTimeout> | null;
  running: boolean;
  again: boolean;
  /** The change was written on this process: the other processes are still to hear of it. */
  tellPeers: boolean;
}

/**
 * Sends the Boil queue to the screens after every committed change. The process where the change
 * was written hears it (listeners run after its commit) and tells the other processes in one small
 * message through socket.io's PostgreSQL adapter; then every process that has screens of that
 * co-op reads one snapshot and sends it to its own screens, and a process without any reads
 * nothing. (The snapshot itself never crosses the adapter: at 19 KB it would go through the
 * adapter's attachment table, where every process, the sender too, reads and decodes it again.)
 * The snapshot is read after the change, so it carries the newest version, a burst of changes
 * makes one snapshot, and a version already sent is not sent again.
 */
export function startQueueBroadcaster(io: Server): () => void {
  const pending = new Map<string, Pending>();
  const sent = new Map<string, number>();
  const lastStart = new Map<string, number>();
  const watched = (cooperativeId: string) => (io.of('/').adapter.rooms.get(coopRoom(cooperativeId))?.size ?? 0) > 0;

  async function flush(cooperativeId: string) {
    const p = pending.get(cooperativeId)!;
    p.timer = null;
    if (p.running) {
      p.again = true;
      return;
    }
    p.running = true;
    lastStart.set(cooperativeId, Date.now());
    try {
      if (p.tellPeers) {
        p.tellPeers = false;
        io.serverSideEmit(PEER_EVENT, cooperativeId);
      }
      if (watched(cooperativeId)) {
        const snapshot = await computeSnapshot(cooperativeId, new Date(), getLiveSequelize());
        // A change already carried by an earlier snapshot is not sent again.
        if (snapshot && snapshot.version > (sent.get(cooperativeId) ?? -1)) {
          sent.set(cooperativeId, snapshot.version);
          rememberSnapshot(cooperativeId, snapshot);
          io.local.to(coopRoom(cooperativeId)).emit('queue', snapshot);
        }
      }
    } catch (err) {
      console.error('queue broadcast failed', err);
    } finally {
      p.running = false;
      if (p.again) {
        p.again = false;
        schedule(cooperativeId, false);
      } else if (!p.timer) pending.delete(cooperativeId);
    }
  }

  function schedule(cooperativeId: string, local: boolean) {
    let p = pending.get(cooperativeId);
    if (!p) pending.set(cooperativeId, (p = { timer: null, running: false, again: false, tellPeers: false }));
    if (local) p.tellPeers = true;
    if (p.running) {
      p.again = true;
      return;
    }
    const wait = Math.max(0, (lastStart.get(cooperativeId) ?? -Infinity) + MIN_GAP_MS - Date.now());
    p.timer ??= setTimeout(() => void flush(cooperativeId), wait);
  }

  const fromPeer = (cooperativeId: unknown) => {
    if (typeof cooperativeId === 'string') schedule(cooperativeId, false);
  };
  io.on(PEER_EVENT, fromPeer);
  const off = onChange(({ cooperativeId }) => schedule(cooperativeId, true));
  return () => {
    off();
    io.off(PEER_EVENT, fromPeer);
  };
}

/** A screen that just joined gets the current queue at once. */
export async function sendCurrentQueue(socket: Socket, cooperativeId: string) {
  try {
    const cached = await currentSnapshot(cooperativeId);
    if (cached) socket.emit('queue', cached.snapshot);
  } catch (err) {
    console.error('queue for a new screen failed', err);
  }
}
