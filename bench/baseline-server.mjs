// The bare baseline: node:http answering the same constant JSON as the app's bench route,
// with nothing of the framework in between. Usage: node bench/baseline-server.mjs PORT
import { createServer } from 'node:http';
import { readFileSync } from 'node:fs';

const body = JSON.stringify(JSON.parse(readFileSync(new URL('./constant.json', import.meta.url), 'utf8')));
const port = Number(process.argv[2] ?? 3999);

createServer((req, res) => {
  res.writeHead(200, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) });
  res.end(body);
}).listen(port, '127.0.0.1', () => console.log(`baseline on http://127.0.0.1:${port}`));
