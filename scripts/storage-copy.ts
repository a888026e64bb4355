/**
 * Copies an existing filesystem store (strike audio, certificate PDFs) to the
 * S3-compatible bucket named by NUXT_STORAGE_* (bucket, region, endpoint,
 * force-path-style, keys), with the same keys:
 *
 *   npm run storage:copy -- --to s3 [--from .data/storage] [--concurrency 4]
 *
 * Resumable: an object already in the bucket with the same SHA-256 (kept in its
 * metadata by every upload, or found by reading it back) is skipped. Every upload is
 * read back and its SHA-256 compared with the file's. Prints a summary; exits 1 when
 * any object failed, 2 for bad arguments. Switch the app over with NUXT_STORAGE_DRIVER=s3
 * after a run that reports no failures; the files stay where they were.
 */
import { createHash } from 'node:crypto'
import { existsSync, statSync } from 'node:fs'
import { resolve } from 'node:path'
import { parseArgs } from 'node:util'
import { HeadObjectCommand } from '@aws-sdk/client-s3'
import { AUDIO_FORMATS } from '../shared/analysis/audioFormats'
import { storageConfigFromEnv } from '../server/utils/blob-storage'
import { fileStorage } from '../server/utils/storage-fs'
import { s3Client, s3Storage, SHA256_METADATA } from '../server/utils/storage-s3'

const { values } = parseArgs({
  options: {
    to: { type: 'string' },
    from: { type: 'string', default: process.env.NUXT_STORAGE_DIR || '.data/storage' },
    concurrency: { type: 'string', default: '4' },
  },
})
function usage(sentence: string): never {
  console.error(`storage:copy: ${sentence}\n  usage: npm run storage:copy -- --to s3 [--from DIR] [--concurrency N]`)
  process.exit(2)
}
if (values.to !== 's3') usage(values.to ? `cannot copy to "${values.to}"; the only target is s3.` : 'say where to copy to: --to s3.')
const from = resolve(values.from!)
if (!existsSync(from) || !statSync(from).isDirectory()) usage(`${from} is not a folder with a filesystem store.`)
const concurrency = Number(values.concurrency)
if (!Number.isInteger(concurrency) || concurrency < 1 || concurrency > 32) usage('--concurrency is a whole number from 1 to 32.')

const config = storageConfigFromEnv()
if (!config.bucket) usage('set NUXT_STORAGE_BUCKET (and NUXT_STORAGE_ENDPOINT, NUXT_STORAGE_REGION, keys) to the target bucket.')
const client = s3Client(config)
const source = fileStorage(from)
const target = s3Storage(config, client)

const TYPES: Record<string, string> = { ...Object.fromEntries(AUDIO_FORMATS.map(f => [f.extension, f.mediaType])), pdf: 'application/pdf' }
const typeOf = (key: string) => TYPES[key.split('.').pop()?.toLowerCase() ?? ''] ?? 'application/octet-stream'
const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')

type Outcome = 'copied' | 'skipped' | 'failed'

/** True when the bucket already holds exactly these bytes under the key. */
async function alreadyThere(key: string, size: number, hash: string) {
  const head = await client.send(new HeadObjectCommand({ Bucket: config.bucket, Key: key })).catch((error: { $metadata?: { httpStatusCode?: number } }) => {
    if (error.$metadata?.httpStatusCode === 404) return null
    throw error
  })
  if (!head || head.ContentLength !== size) return false
  if (head.Metadata?.[SHA256_METADATA]) return head.Metadata[SHA256_METADATA] === hash
  const bytes = await target.get(key)
  return bytes !== null && sha256(bytes) === hash
}

async function copyOne(key: string): Promise<{ outcome: Outcome, bytes: number, error?: string }> {
  try {
    const bytes = await source.get(key)
    if (!bytes) return { outcome: 'failed', bytes: 0, error: 'the file went away during the copy' }
    const hash = sha256(bytes)
    if (await alreadyThere(key, bytes.byteLength, hash)) return { outcome: 'skipped', bytes: 0 }
    await target.put(key, bytes, typeOf(key))
    const back = await target.get(key)
    if (!back || sha256(back) !== hash) return { outcome: 'failed', bytes: 0, error: 'the uploaded object reads back with another SHA-256' }
    return { outcome: 'copied', bytes: bytes.byteLength }
  }
  catch (error) {
    return { outcome: 'failed', bytes: 0, error: (error as Error).message || String(error) }
  }
}

const started = Date.now()
try {
  await target.ping()
}
catch (error) {
  console.error(`storage:copy: the bucket "${config.bucket}" cannot be reached at ${config.endpoint || 'the default S3 endpoint'}: ${(error as Error).name || (error as Error).message}.`)
  process.exit(1)
}
const keys = (await source.list('')).map(o => o.key).sort()
const counts: Record<Outcome, number> = { copied: 0, skipped: 0, failed: 0 }
let copiedBytes = 0
let next = 0
async function worker() {
  while (next < keys.length) {
    const key = keys[next++]!
    const result = await copyOne(key)
    counts[result.outcome]++
    copiedBytes += result.bytes
    if (result.error) console.error(`  failed ${key}: ${result.error}`)
  }
}
await Promise.all(Array.from({ length: Math.min(concurrency, Math.max(keys.length, 1)) }, worker))
const seconds = (Date.now() - started) / 1000
console.log(`storage:copy ${from} → s3://${config.bucket}: ${keys.length} objects, ${counts.copied} copied (${(copiedBytes / 1e6).toFixed(1)} MB, SHA-256 verified), ${counts.skipped} skipped (already there, same SHA-256), ${counts.failed} failed, in ${seconds.toFixed(1)} s.`)
if (counts.failed > 0) {
  console.error('storage:copy: run it again to retry the failed objects; nothing already copied is sent twice.')
  process.exitCode = 1
}
