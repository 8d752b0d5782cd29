// A local fake of the object-storage service (s3rver) on loopback, for development and tests.
// Usage: node scripts/s3-server.mjs PORT DATA_DIR BUCKET
import S3rver from 's3rver';
import { mkdirSync } from 'node:fs';

const [port = '9200', directory = '.data/s3', bucket = 'brixhouse'] = process.argv.slice(2);
mkdirSync(directory, { recursive: true });

const server = new S3rver({
  address: '127.0.0.1',
  port: Number(port),
  directory,
  configureBuckets: [{ name: bucket }],
  silent: true,
});
await server.run();
console.log(`object store on http://127.0.0.1:${port} (bucket ${bucket}, data in ${directory})`);

const stop = () => server.close().finally(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
