/**
 * The local S3 fake (s3rver) on loopback, for `NUXT_STORAGE_DRIVER=s3` under
 * `npm start` and for `npm test`: objects are files under --dir, the buckets named
 * by --bucket (comma-separated) exist from the start.
 *
 *   npx tsx scripts/s3-fake.ts --port 4570 --dir .data/s3 --bucket tonewright
 *
 * Writes its process id to --pid-file (default `<dir>/s3-fake.pid`) so the scripts end exactly this process.
 */
import { createReadStream } from 'node:fs'
import { mkdir, rm, writeFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { parseArgs } from 'node:util'
// @ts-expect-error s3rver ships no type declarations.
import S3rver from 's3rver'

const { values } = parseArgs({
  options: {
    'port': { type: 'string', default: '4570' },
    'dir': { type: 'string', default: '.data/s3' },
    'bucket': { type: 'string', default: 'tonewright' },
    'pid-file': { type: 'string' },
  },
})
const port = Number(values.port)
if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error(`s3-fake: --port must be a port number, not "${values.port}".`)
  process.exit(2)
}
const dir = resolve(values.dir!)
const buckets = values.bucket!.split(',').map(b => b.trim()).filter(Boolean)
await mkdir(join(dir, 'objects'), { recursive: true })

const server = new S3rver({
  address: '127.0.0.1',
  port,
  silent: true,
  directory: join(dir, 'objects'),
  configureBuckets: buckets.map(name => ({ name })),
})
// s3rver 3.7.1 reads a last byte of 0 (`bytes=0-0`) as "to the end"; S3 answers one byte.
const store = server.store
const getObject = store.getObject.bind(store)
store.getObject = async (bucket: string, key: string, options?: { start?: number, end?: number }) => {
  if (options?.end !== 0) return getObject(bucket, key, options)
  const object = await getObject(bucket, key, { start: 0 })
  if (!object?.content) return object
  object.content.destroy()
  object.content = createReadStream(store.getResourcePath(bucket, key, 'object'), { start: 0, end: 0 })
  object.range = { start: 0, end: 0 }
  return object
}
await server.run()
const pidFile = resolve(values['pid-file'] ?? join(dir, 's3-fake.pid'))
await writeFile(pidFile, String(process.pid))
console.log(`s3-fake: listening on http://127.0.0.1:${port} (buckets ${buckets.join(', ')}, objects in ${dir}/objects)`)

async function stop() {
  await rm(pidFile, { force: true })
  await server.close().catch(() => {})
  process.exit(0)
}
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
