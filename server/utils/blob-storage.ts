import { fileStorage } from './storage-fs'
import { s3Storage } from './storage-s3'
import { STORAGE_DRIVERS, type BlobStorage, type StorageConfig } from './storage'

/** The store a configuration names (`driver` fs or s3). */
export function storageFromConfig(config: StorageConfig): BlobStorage {
  if (config.driver === 'fs') return fileStorage(config.dir)
  if (config.driver === 's3') return s3Storage(config)
  throw new Error(`Storage driver "${config.driver}" is not known; use one of ${STORAGE_DRIVERS.join(', ')}.`)
}

/** The same settings as the app's runtime config, from NUXT_STORAGE_* (for scripts run outside Nitro). */
export function storageConfigFromEnv(env: NodeJS.ProcessEnv = process.env): StorageConfig {
  return {
    driver: env.NUXT_STORAGE_DRIVER || 'fs',
    dir: env.NUXT_STORAGE_DIR || '.data/storage',
    bucket: env.NUXT_STORAGE_BUCKET ?? '',
    region: env.NUXT_STORAGE_REGION ?? '',
    endpoint: env.NUXT_STORAGE_ENDPOINT ?? '',
    forcePathStyle: env.NUXT_STORAGE_FORCE_PATH_STYLE ?? false,
    accessKeyId: env.NUXT_STORAGE_ACCESS_KEY_ID ?? '',
    secretAccessKey: env.NUXT_STORAGE_SECRET_ACCESS_KEY ?? '',
  }
}

let storage: BlobStorage | undefined

/** The configured storage (runtime config `storage`, NUXT_STORAGE_*), one per process. */
export function useBlobStorage(): BlobStorage {
  if (storage) return storage
  storage = storageFromConfig(useRuntimeConfig().storage as StorageConfig)
  return storage
}
