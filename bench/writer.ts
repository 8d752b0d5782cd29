// A separate process that logs the live benchmark's drop-offs: one POST every `everyMs`, each
// answer timed as it arrives. (In the bench process the answers would be timed late: its event
// loop also drives autocannon's 50 connections, so a lot could reach a viewer "before" its
// answer.) Usage (forked): writer.ts URL COOKIE; send { type: 'write', bodies, everyMs }.
const [url, cookie] = process.argv.slice(2);
const appOrigin = new URL(url).origin;

process.on('message', async (msg: { type: string; path: string; bodies: string[]; everyMs: number }) => {
  if (msg.type !== 'write') return;
  const written: { id: string; answeredAt: number }[] = [];
  let failed = 0;
  const posts: Promise<void>[] = [];
  const start = Date.now();
  for (let i = 0; i < msg.bodies.length; i++) {
    const wait = start + i * msg.everyMs - Date.now();
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    posts.push(
      (async () => {
        try {
          const res = await fetch(`${url}${msg.path}`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', accept: 'application/json', cookie, origin: appOrigin },
            body: msg.bodies[i],
          });
          const text = await res.text();
          const answeredAt = Date.now();
          const id = res.ok ? (JSON.parse(text) as { id?: unknown }).id : undefined;
          if (typeof id === 'string') written.push({ id, answeredAt });
          else failed++;
        } catch {
          failed++;
        }
      })(),
    );
  }
  await Promise.all(posts);
  process.send?.({ type: 'written', written, failed });
  setTimeout(() => process.exit(0), 50);
});
process.send?.({ type: 'ready' });
