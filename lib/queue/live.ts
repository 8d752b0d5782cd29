// Runs in server.ts (plain Node): no 'server-only' marker.
import type { Server, Socket } from 'socket.io';
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

interface Pending {
  timer: ReturnType<typeof setTimeout> | null;
  running: boolean;
  again: boolean;
}

/**
 * Broadcasts the Boil queue after every committed change. Only the process where the change was
 * written hears it (listeners run after its commit), so each change is computed once, not once
 * per process or per socket; socket.io's PostgreSQL adapter carries the one `queue` event to the
 * screens on every other process. The snapshot is read after the change, so it carries the newest
 * version, and a burst of changes makes one snapshot.
 */
export function startQueueBroadcaster(io: Server): () => void {
  const pending = new Map<string, Pending>();
  const sent = new Map<string, number>();
  const lastStart = new Map<string, number>();

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
      const snapshot = await computeSnapshot(cooperativeId);
      // A change already carried by an earlier snapshot is not sent again.
      if (snapshot && snapshot.version > (sent.get(cooperativeId) ?? -1)) {
        sent.set(cooperativeId, snapshot.version);
        rememberSnapshot(cooperativeId, snapshot);
        io.to(coopRoom(cooperativeId)).emit('queue', snapshot);
      }
    } catch (err) {
      console.error('queue broadcast failed', err);
    } finally {
      p.running = false;
      if (p.again) {
        p.again = false;
        schedule(cooperativeId);
      } else if (!p.timer) pending.delete(cooperativeId);
    }
  }

  function schedule(cooperativeId: string) {
    let p = pending.get(cooperativeId);
    if (!p) pending.set(cooperativeId, (p = { timer: null, running: false, again: false }));
    if (p.running) {
      p.again = true;
      return;
    }
    const wait = Math.max(0, (lastStart.get(cooperativeId) ?? -Infinity) + MIN_GAP_MS - Date.now());
    p.timer ??= setTimeout(() => void flush(cooperativeId), wait);
  }

  return onChange(({ cooperativeId }) => schedule(cooperativeId));
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
