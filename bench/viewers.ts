// A separate process of live-queue viewers: N socket.io clients on /realtime, signed in by a
// session cookie. The bench process tells it which lots were written and when their HTTP answer
// came; at the end it reports, per lot and viewer, how long after that answer the first
// snapshot holding the lot arrived. Usage (forked): viewers.ts URL[,URL2] COUNT COOKIE
//
// One process stands in for N devices, so it must not add its own work in series to the figures:
// with every viewer parsing every 19 KB snapshot, the 500th viewer's receipt would wait for 499
// parses of the same frame before it (each device parses only its own). So a `queue` frame is
// timed as it arrives and kept unparsed; each distinct snapshot (by its version) is parsed once,
// by the first viewer that gets it, to learn which lots it holds.
import { io, type Socket } from 'socket.io-client';
import { Decoder, Encoder, PacketType } from 'socket.io-parser';

const [urls, countArg, cookie] = process.argv.slice(2);
const count = Number(countArg);
const addresses = urls.split(',');

interface Snapshot {
  version: number;
  lots: { deliveryId: string }[];
}

/** How the server encodes a `queue` event on the main namespace (socket.io protocol 5). */
const QUEUE_FRAME = '2["queue",';

/** Hands a `queue` event's body on as the raw JSON text; every other packet is decoded as usual. */
class ArrivalDecoder extends Decoder {
  add(obj: unknown) {
    if (typeof obj === 'string' && obj.startsWith(QUEUE_FRAME) && obj.endsWith(']')) {
      this.emitReserved('decoded', { type: PacketType.EVENT, nsp: '/', data: ['queue', obj.slice(QUEUE_FRAME.length, -1)] });
      return;
    }
    super.add(obj);
  }
}
const parser = { Encoder, Decoder: ArrivalDecoder };

/** The lots each snapshot version holds (parsed once per version). */
const lotsOf = new Map<number, string[]>();
function versionOf(raw: string): number {
  const m = /^\{"version":(\d+),/.exec(raw);
  if (m) return Number(m[1]);
  return (JSON.parse(raw) as Snapshot).version;
}

/** Per viewer: when each snapshot version arrived, in order. */
const arrivals: [version: number, at: number][][] = [];
const sockets: Socket[] = [];
let connected = 0;

for (let i = 0; i < count; i++) {
  const arrived: [number, number][] = [];
  arrivals.push(arrived);
  const socket = io(addresses[i % addresses.length], {
    parser,
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
  socket.on('queue', (raw: string) => {
    const now = Date.now();
    const version = versionOf(raw);
    if (!lotsOf.has(version)) lotsOf.set(version, (JSON.parse(raw) as Snapshot).lots.map((l) => l.deliveryId));
    arrived.push([version, now]);
  });
  sockets.push(socket);
}

process.on('message', (msg: { type: string; lots?: { id: string; answeredAt: number }[] }) => {
  if (msg.type !== 'report' || !msg.lots) return;
  const firstSeen = arrivals.map((arrived) => {
    const seen = new Map<string, number>();
    for (const [version, at] of arrived) for (const id of lotsOf.get(version)!) if (!seen.has(id)) seen.set(id, at);
    return seen;
  });
  const latencies: number[] = [];
  /** Per lot, the first viewer's receipt: the server's own part, before it writes to the rest. */
  const first: number[] = [];
  let missing = 0;
  for (const lot of msg.lots) {
    let earliest = Infinity;
    for (const seen of firstSeen) {
      const at = seen.get(lot.id);
      if (at === undefined) missing++;
      else {
        latencies.push(Math.max(0, at - lot.answeredAt));
        earliest = Math.min(earliest, at - lot.answeredAt);
      }
    }
    if (earliest !== Infinity) first.push(Math.max(0, earliest));
  }
  // With two server processes: each one's viewers apart (viewer i is on address i mod n).
  const byAddress = addresses.map((address, a) => {
    const xs: number[] = [];
    for (const lot of msg.lots!) {
      for (let i = a; i < firstSeen.length; i += addresses.length) {
        const at = firstSeen[i].get(lot.id);
        if (at !== undefined) xs.push(Math.max(0, at - lot.answeredAt));
      }
    }
    return { address, latencies: xs };
  });
  process.send?.({ type: 'report', latencies, first, byAddress, missing, expected: msg.lots.length * count });
  for (const s of sockets) s.close();
  setTimeout(() => process.exit(0), 200);
});
