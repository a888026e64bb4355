import { createReadStream, type Stats } from 'node:fs'
import { access, constants, mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises'
import { dirname, relative, resolve, sep } from 'node:path'
import { checkKey, InvalidStorageKey, type BlobStorage, type StoredObject } from './storage'

/** The suffix of a file being written, renamed to its key once whole. */
const PARTIAL = '.partial'

const missing = (error: unknown) => (error as NodeJS.ErrnoException).code === 'ENOENT'

/** Objects as files under `root`, keys as relative paths. */
export function fileStorage(root: string): BlobStorage {
  const base = resolve(root)
  const pathOf = (key: string) => {
    checkKey(key)
    const path = resolve(base, key)
    if (!path.startsWith(base + sep)) throw new InvalidStorageKey(key)
    return path
  }
  const head = async (key: string) => {
    const info = await stat(pathOf(key)).catch((error) => {
      if (missing(error)) return null
      throw error
    })
    return info?.isFile() ? { size: info.size, modifiedAt: info.mtime } : null
  }
  /** Every file under a folder prefix, with its stat, and whether it is a write still under way (or abandoned). */
  const filesUnder = async (prefix: string) => {
    const dir = prefix === '' ? base : pathOf(prefix.replace(/\/+$/, ''))
    let entries: string[]
    try {
      entries = await readdir(dir, { recursive: true })
    }
    catch (error) {
      if (missing(error)) return []
      throw error
    }
    const files: { key: string, info: Stats, partial: boolean }[] = []
    for (const entry of entries) {
      const path = resolve(dir, entry)
      const info = await stat(path).catch(() => null)
      if (info?.isFile()) files.push({ key: relative(base, path).split(sep).join('/'), info, partial: entry.endsWith(PARTIAL) })
    }
    return files
  }
  return {
    async put(key, bytes) {
      const path = pathOf(key)
      await mkdir(dirname(path), { recursive: true })
      // Written beside and renamed, so a reader never sees half an object.
      const partial = `${path}.${process.pid}${PARTIAL}`
      await writeFile(partial, bytes)
      await rename(partial, path)
    },
    async get(key) {
      try {
        return new Uint8Array(await readFile(pathOf(key)))
      }
      catch (error) {
        if (missing(error)) return null
        throw error
      }
    },
    head,
    async stream(key, range) {
      const path = pathOf(key)
      if (!await head(key)) return null
      return createReadStream(path, range ? { start: range.start, end: range.end } : {})
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
        if (missing(error)) return false
        throw error
      }
    },
    async list(prefix) {
      const found: StoredObject[] = []
      for (const { key, info, partial } of await filesUnder(prefix)) {
        if (!partial) found.push({ key, modifiedAt: info.mtime })
      }
      return found
    },
    async clearUnfinished(prefix, olderThanMs, now) {
      const removed: string[] = []
      for (const { key, info, partial } of await filesUnder(prefix)) {
        if (!partial || now.getTime() - info.mtime.getTime() < olderThanMs) continue
        await rm(resolve(base, key), { force: true })
        removed.push(key)
      }
      return removed
    },
    async ping() {
      await mkdir(base, { recursive: true })
      await access(base, constants.R_OK | constants.W_OK)
    },
  }
}
