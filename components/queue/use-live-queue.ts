'use client';

import { useEffect, useState } from 'react';
import { io } from 'socket.io-client';
import type { QueueSnapshot } from '@/lib/queue/types';

export type LiveStatus = 'live' | 'connecting' | 'offline';

/** A newer version wins; the same version recomputed later (ETAs move with the clock) also does. */
export function newer(next: QueueSnapshot, current: QueueSnapshot): boolean {
  return next.version > current.version || (next.version === current.version && next.computedAt > current.computedAt);
}

/**
 * The Boil queue, live: starts from the server-rendered snapshot, applies every newer `queue`
 * snapshot from the socket, and after a dropped connection (or the browser coming back online)
 * reads the current one from GET /api/queue. A display screen signs its socket with its token.
 */
export function useLiveQueue(initial: QueueSnapshot, { displayToken }: { displayToken?: string } = {}) {
  const [snapshot, setSnapshot] = useState(initial);
  const [status, setStatus] = useState<LiveStatus>('connecting');

  useEffect(() => {
    const apply = (next: QueueSnapshot) => setSnapshot((cur) => (newer(next, cur) ? next : cur));
    const socket = io({ path: '/realtime', transports: ['websocket'], auth: displayToken ? { displayToken } : undefined });
    const resync = async () => {
      if (displayToken) return; // a display gets the current queue from its socket on every (re)connect
      try {
        const res = await fetch('/api/queue', { cache: 'no-store', headers: { accept: 'application/json' } });
        if (res.ok) apply((await res.json()) as QueueSnapshot);
      } catch {
        /* still offline: the next reconnect tries again */
      }
    };
    socket.on('queue', apply);
    socket.on('connect', () => {
      setStatus('live');
      void resync();
    });
    socket.on('disconnect', () => setStatus(navigator.onLine ? 'connecting' : 'offline'));
    socket.on('connect_error', () => setStatus(navigator.onLine ? 'connecting' : 'offline'));
    const offline = () => {
      setStatus('offline');
      socket.disconnect();
    };
    const online = () => {
      setStatus('connecting');
      socket.connect();
      void resync();
    };
    window.addEventListener('offline', offline);
    window.addEventListener('online', online);
    return () => {
      window.removeEventListener('offline', offline);
      window.removeEventListener('online', online);
      socket.close();
    };
  }, [displayToken]);

  return { snapshot, status };
}
