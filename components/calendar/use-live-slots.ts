'use client';

import { useEffect, useRef, useState } from 'react';
import { io } from 'socket.io-client';

export type LiveStatus = 'connecting' | 'live' | 'offline';

/**
 * Listens for the co-op's `slots:changed` broadcasts and calls `onChange` for each one, and
 * again after a reconnect, since changes made while the socket was away were never heard.
 */
export function useLiveSlots(onChange: () => void): LiveStatus {
  const [status, setStatus] = useState<LiveStatus>('connecting');
  const latest = useRef(onChange);
  useEffect(() => {
    latest.current = onChange;
  }, [onChange]);

  useEffect(() => {
    // WebSocket only: one connection stays on one server process, with no sticky sessions needed.
    const socket = io({ path: '/realtime', transports: ['websocket'] });
    const changed = () => latest.current();
    const up = () => setStatus('live');
    const down = () => setStatus('offline');
    socket.on('connect', up);
    socket.on('disconnect', down);
    socket.on('connect_error', down);
    socket.on('slots:changed', changed);
    socket.io.on('reconnect', changed);
    return () => {
      socket.io.off('reconnect', changed);
      socket.removeAllListeners();
      socket.disconnect();
    };
  }, []);

  return status;
}
