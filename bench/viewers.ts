// A separate process of live-queue viewers: N socket.io clients on /realtime, signed in by a
// session cookie. The bench process tells it which lots were written and when their HTTP answer
// came; at the end it reports, per lot and viewer, how long after that answer the first
// snapshot holding the lot arrived. Usage (forked): viewers.ts URL[,URL2] COUNT COOKIE
import { io, type Socket } from 'socket.io-client';

const [urls, countArg, cookie] = process.argv.slice(2);
const count = Number(countArg);
const addresses = urls.split(',');

interface Snapshot {
  version: number;
  lots: { deliveryId: string }[];
}

/** Per viewer: when it first saw each lot. */
const firstSeen: Map<string, number>[] = [];
const sockets: Socket[] = [];
let connected = 0;

for (let i = 0; i < count; i++) {
  const seen = new Map<string, number>();
  firstSeen.push(seen);
  const socket = io(addresses[i % addresses.length], {
    path: '/realtime',
    transports: ['websocket'],
    extraHeaders: { cookie },
    reconnection: true,
  });
  socket.on('connect', () => {
    connected++;
    if (connected === count) process.send?.({ type: 'ready' });
  });
  socket.on('connect_error', (err) => process.send?.({ type: 'error', message: err.message }));
  socket.on('queue', (snapshot: Snapshot) => {
    const now = Date.now();
    for (const lot of snapshot.lots) if (!seen.has(lot.deliveryId)) seen.set(lot.deliveryId, now);
  });
  sockets.push(socket);
}

process.on('message', (msg: { type: string; lots?: { id: string; answeredAt: number }[] }) => {
  if (msg.type !== 'report' || !msg.lots) return;
  const latencies: number[] = [];
  let missing = 0;
  for (const lot of msg.lots) {
    for (const seen of firstSeen) {
      const at = seen.get(lot.id);
      if (at === undefined) missing++;
      else latencies.push(Math.max(0, at - lot.answeredAt));
    }
  }
  process.send?.({ type: 'report', latencies, missing, expected: msg.lots.length * count });
  for (const s of sockets) s.close();
  setTimeout(() => process.exit(0), 200);
});
