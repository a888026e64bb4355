import { randomUUID } from 'node:crypto'
import { CreateBucketCommand } from '@aws-sdk/client-s3'
import { s3Client, type S3StorageConfig } from '../../../server/utils/storage-s3'

/** The S3 fake scripts/test.sh started (s3rver on loopback). */
export const S3_ENDPOINT = process.env.TW_S3_ENDPOINT ?? 'http://127.0.0.1:4571'
const KEY = process.env.TW_S3_KEY ?? 'S3RVER'

/** Settings for a bucket on the fake (not made yet). */
export function fakeBucketConfig(bucket: string): S3StorageConfig {
  return { bucket, region: 'us-east-1', endpoint: S3_ENDPOINT, forcePathStyle: true, accessKeyId: KEY, secretAccessKey: KEY }
}

/** A new, empty bucket on the fake, so every test starts from nothing. */
export async function freshBucket(prefix = 'tw') {
  const config = fakeBucketConfig(`${prefix}-${randomUUID().slice(0, 8)}`)
  await s3Client(config).send(new CreateBucketCommand({ Bucket: config.bucket }))
  return config
}

/** The NUXT_STORAGE_* environment of an app server (or script) on that bucket. */
export function s3Env(config: S3StorageConfig): Record<string, string> {
  return {
    NUXT_STORAGE_DRIVER: 's3', NUXT_STORAGE_BUCKET: config.bucket, NUXT_STORAGE_REGION: config.region,
    NUXT_STORAGE_ENDPOINT: config.endpoint, NUXT_STORAGE_FORCE_PATH_STYLE: 'true',
    NUXT_STORAGE_ACCESS_KEY_ID: config.accessKeyId, NUXT_STORAGE_SECRET_ACCESS_KEY: config.secretAccessKey,
  }
}
