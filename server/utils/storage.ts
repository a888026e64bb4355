import type { Readable } from 'node:stream'

/** One stored object as listed: its key and when it was last written. */
export interface StoredObject { key: string, modifiedAt: Date }

/** What a stored object is without reading it. */
export interface ObjectInfo { size: number, modifiedAt: Date }

/** A byte range, both ends inclusive (as in HTTP's Range header). */
export interface ByteRange { start: number, end: number }

/**
 * Where strike audio and certificate PDFs live: the filesystem driver
 * (storage-fs.ts, the default) or an S3-compatible bucket (storage-s3.ts). Both
 * pass the same contract tests (tests/integration/server/utils/storage.test.ts).
 */
export interface BlobStorage {
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>
  get(key: string): Promise<Uint8Array | null>
  /** Size and time of an object, null when it does not exist. */
  head(key: string): Promise<ObjectInfo | null>
  /** The object's bytes (or `range` of them) as a stream, null when it does not exist. */
  stream(key: string, range?: ByteRange): Promise<Readable | null>
  delete(key: string): Promise<void>
  /** Renames an object; false when `from` does not exist. */
  move(from: string, to: string): Promise<boolean>
  /** Every object whose key starts with `prefix` (a folder, ending in `/`; '' for the whole store). */
  list(prefix: string): Promise<StoredObject[]>
  /**
   * Removes what a process killed mid-write left under `prefix`, last touched `olderThanMs`
   * or more before `now`; answers what it removed. `list` never shows such leftovers, so
   * without this they would stay for good. A bucket keeps none: a PUT is whole or absent.
   */
  clearUnfinished(prefix: string, olderThanMs: number, now: Date): Promise<string[]>
  /** Resolves when the store can be reached (readiness), rejects otherwise. */
  ping(): Promise<void>
}

/** A key no object may have: it would leave its folder or the store. */
export class InvalidStorageKey extends Error {
  constructor(key: string) {
    super(`Invalid storage key: ${JSON.stringify(key.slice(0, 300))}`)
  }
}

const KEY = /^[a-z0-9][a-z0-9/_.-]{0,250}$/i

/**
 * Keys are relative, plain ASCII paths: no leading slash, no `..` segment, no
 * percent-encoding or backslash, so no driver can be led out of its folder or bucket prefix.
 */
export function checkKey(key: string) {
  if (!KEY.test(key) || key.split('/').some(part => part === '..' || part === '.') || key.includes('//')) throw new InvalidStorageKey(key)
}

/** A listing prefix (a folder, '' for the whole store) holds a key no object could leave its folder with. */
export function checkPrefix(prefix: string) {
  if (prefix !== '') checkKey(prefix.replace(/\/+$/, ''))
}

/** Runtime config `storage` (NUXT_STORAGE_*). */
export interface StorageConfig {
  driver: string
  dir: string
  bucket: string
  region: string
  endpoint: string
  forcePathStyle: boolean | string
  accessKeyId: string
  secretAccessKey: string
}

export const STORAGE_DRIVERS = ['fs', 's3'] as const
