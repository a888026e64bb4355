import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises'
import { dirname, relative, resolve, sep } from 'node:path'

/** One stored object as listed: its key and when it was last written. */
export interface StoredObject { key: string, modifiedAt: Date }

/**
 * Where strike audio and certificate PDFs live. The filesystem driver is the
 * default; an S3-compatible driver implements the same calls (`move` as copy and delete).
 */
export interface BlobStorage {
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>
  get(key: string): Promise<Uint8Array | null>
  delete(key: string): Promise<void>
  /** Renames an object; false when `from` does not exist. */
  move(from: string, to: string): Promise<boolean>
  /** Every object whose key starts with `prefix` (a folder, ending in `/`). */
  list(prefix: string): Promise<StoredObject[]>
}

const KEY = /^[a-z0-9][a-z0-9/_.-]{0,250}$/i

function checkKey(key: string) {
  if (!KEY.test(key) || key.includes('..')) throw new Error(`Invalid storage key: ${key}`)
}

export function fileStorage(root: string): BlobStorage {
  const base = resolve(root)
  const pathOf = (key: string) => {
    checkKey(key)
    const path = resolve(base, key)
    if (!path.startsWith(base + sep)) throw new Error(`Invalid storage key: ${key}`)
    return path
  }
  return {
    async put(key, bytes) {
      const path = pathOf(key)
      await mkdir(dirname(path), { recursive: true })
      await writeFile(path, bytes)
    },
    async get(key) {
      try {
        return new Uint8Array(await readFile(pathOf(key)))
      }
      catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null
        throw error
      }
    },
    async delete(key) {
      await rm(pathOf(key), { force: true })
    },
    async move(from, to) {
      const target = pathOf(to)
      await mkdir(dirname(target), { recursive: true })
      try {
        await rename(pathOf(from), target)
        return true
      }
      catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false
        throw error
      }
    },
    async list(prefix) {
      const dir = pathOf(prefix.replace(/\/+$/, ''))
      let entries: string[]
      try {
        entries = await readdir(dir, { recursive: true })
      }
      catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return []
        throw error
      }
      const found: StoredObject[] = []
      for (const entry of entries) {
        const path = resolve(dir, entry)
        const info = await stat(path).catch(() => null)
        if (info?.isFile()) found.push({ key: relative(base, path).split(sep).join('/'), modifiedAt: info.mtime })
      }
      return found
    },
  }
}

let storage: BlobStorage | undefined

/** The configured storage (runtime config `storage.driver`, `storage.dir`). */
export function useBlobStorage(): BlobStorage {
  if (storage) return storage
  const config = useRuntimeConfig().storage as { driver: string, dir: string }
  if (config.driver !== 'fs') throw new Error(`Storage driver "${config.driver}" is not available in this build; use "fs".`)
  storage = fileStorage(config.dir)
  return storage
}
