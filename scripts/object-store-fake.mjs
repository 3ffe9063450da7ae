// The local S3-compatible object store the project starts in development and tests (never in
// production): s3rver on 127.0.0.1, its files under .data/<profile>/objects. Besides the photo
// bucket it keeps a handshake bucket named from a random token that scripts/lib.mjs wrote, so a
// later start can tell this store from a stranger listening on the same port.
import S3rver from 's3rver';

const port = Number(process.env.BONDMAP_S3_FAKE_PORT);
const directory = process.env.BONDMAP_S3_FAKE_DIR;
const bucket = process.env.BONDMAP_S3_BUCKET;
const token = process.env.BONDMAP_S3_FAKE_TOKEN;
if (!port || !directory || !bucket || !token) {
  console.error('[object-store] BONDMAP_S3_FAKE_PORT, BONDMAP_S3_FAKE_DIR, BONDMAP_S3_BUCKET and BONDMAP_S3_FAKE_TOKEN are required');
  process.exit(2);
}

const server = new S3rver({
  address: '127.0.0.1',
  port,
  directory,
  silent: true,
  configureBuckets: [{ name: bucket }, { name: `bondmap-handshake-${token}` }],
});
await server.run();
console.error(`[object-store] listening on 127.0.0.1:${port}, bucket ${bucket}`);

const stop = () => server.close().finally(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
