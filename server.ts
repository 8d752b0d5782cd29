import { createServer } from 'node:http';
import next from 'next';
import { Server } from 'socket.io';
import { createAdapter } from '@socket.io/postgres-adapter';
import { parse as parseCookie } from 'cookie';
import { getToken } from 'next-auth/jwt';
import { env } from '@/lib/env';
import { coopRoom, personRoom, setRealtimeServer } from '@/lib/realtime';
import { personFromClaims } from '@/lib/server/person';
import { startMailWorker, stopMailQueue } from '@/lib/mail/outbox';
import { startStatementWorker } from '@/lib/ledger/statement-mail';
import { getLiveSequelize, getSequelize } from '@/db';
import { displayRoom, findDisplayLink } from '@/lib/display/tokens';
import { sendCurrentQueue, startQueueBroadcaster } from '@/lib/queue/live';
import { createAdapterPool } from '@/lib/server/adapter-pool';
import { ownOrigins } from '@/lib/security/requests';
import { CLIENT_IP_HEADER } from '@/lib/security/client-ip';

async function main() {
  const e = env();
  const dev = e.NODE_ENV !== 'production';
  const hostname = '127.0.0.1';
  const app = next({ dev, hostname, port: e.PORT });
  const handle = app.getRequestHandler();
  await app.prepare();

  const server = createServer((req, res) => {
    // The peer's address, for the sign-in limits; a value sent by the client is never trusted.
    req.headers[CLIENT_IP_HEADER] = req.socket.remoteAddress ?? 'unknown';
    handle(req, res).catch((err) => {
      console.error(err);
      res.statusCode = 500;
      res.end('Internal error');
    });
  });

  // socket.io on its own path. A socket passes the same check as a request: next-auth's token
  // reader, then the person as the database has them now (exists, session version current).
  const io = new Server(server, {
    path: '/realtime',
    serveClient: false,
    // A page of another site may not open a socket with this site's cookie.
    allowRequest: (req, callback) => {
      const origin = req.headers.origin;
      if (!origin) return callback(null, true);
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === 'string') headers.set(k, v);
      callback(null, ownOrigins(headers, 'http:', [e.APP_URL, process.env.NEXTAUTH_URL]).includes(origin));
    },
  });
  // Events reach the sockets of every server process that shares the database.
  // Its listening connection comes back after a database restart (see createAdapterPool).
  const adapterPool = createAdapterPool(e.DATABASE_URL);
  io.adapter(
    createAdapter(adapterPool, {
      tableName: 'socket_io_attachments',
      errorHandler: (err) => console.error('realtime adapter:', err.message),
    }),
  );
  io.use(async (socket, nextFn) => {
    try {
      // A sugarhouse screen opened by a display link: read-only, its co-op's queue only.
      const displayToken = (socket.handshake.auth as { displayToken?: unknown } | undefined)?.displayToken;
      if (displayToken !== undefined) {
        const link = await findDisplayLink(displayToken);
        if (!link) return nextFn(new Error('This display link is not valid.'));
        socket.data.display = { kind: 'display', displayLinkId: link.id, cooperativeId: link.cooperativeId };
        return nextFn();
      }
      const req = { headers: socket.request.headers, cookies: parseCookie(socket.request.headers.cookie ?? '') };
      const claims = await getToken({ req: req as unknown as Parameters<typeof getToken>[0]['req'], secret: e.NEXTAUTH_SECRET });
      const person = await personFromClaims(claims);
      if (!person) return nextFn(new Error('Please sign in first.'));
      socket.data.user = { id: person.actor.userId, role: person.actor.role, cooperativeId: person.cooperativeId };
      nextFn();
    } catch {
      nextFn(new Error('Please sign in first.'));
    }
  });
  io.on('connection', (socket) => {
    const cooperativeId: string = socket.data.display?.cooperativeId ?? socket.data.user.cooperativeId;
    socket.join(coopRoom(cooperativeId));
    if (socket.data.display) socket.join(displayRoom(socket.data.display.displayLinkId));
    else socket.join(personRoom(socket.data.user.id));
    void sendCurrentQueue(socket, cooperativeId);
  });
  setRealtimeServer(io);
  startQueueBroadcaster(io);

  await startMailWorker();
  await startStatementWorker();
  // Open the pool's standing connections now rather than on the first request.
  await Promise.all([getSequelize().query('SELECT 1'), getSequelize().query('SELECT 1'), getLiveSequelize().query('SELECT 1')]).catch((err) =>
    console.error('database not reachable yet:', err.message),
  );

  server.listen(e.PORT, hostname, () => {
    console.log(`Brixhouse is serving on http://${hostname}:${e.PORT} (${dev ? 'development' : 'production'})`);
  });

  const shutdown = async () => {
    io.close();
    server.close();
    await adapterPool.end().catch(() => undefined);
    await stopMailQueue().catch(() => undefined);
    await getSequelize().close().catch(() => undefined);
    await getLiveSequelize().close().catch(() => undefined);
    process.exit(0);
  };
  process.on('SIGTERM', shutdown);
  process.on('SIGINT', shutdown);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
