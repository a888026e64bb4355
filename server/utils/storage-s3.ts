import { createHash } from 'node:crypto'
import { Readable } from 'node:stream'
import {
  CopyObjectCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, HeadObjectCommand,
  ListObjectsV2Command, PutObjectCommand, S3Client, S3ServiceException,
} from '@aws-sdk/client-s3'
import { checkKey, checkPrefix, type BlobStorage, type StorageConfig, type StoredObject } from './storage'

export type S3StorageConfig = Pick<StorageConfig, 'bucket' | 'region' | 'endpoint' | 'forcePathStyle' | 'accessKeyId' | 'secretAccessKey'>

/** The object's SHA-256 (hex) is kept in its metadata, so a copy can tell an object is already there. */
export const SHA256_METADATA = 'sha256'

function notFound(error: unknown) {
  if (!(error instanceof S3ServiceException)) return false
  return error.$metadata.httpStatusCode === 404 || error.name === 'NoSuchKey' || error.name === 'NotFound'
}

export function s3Client(config: S3StorageConfig) {
  return new S3Client({
    region: config.region || 'us-east-1',
    endpoint: config.endpoint || undefined,
    forcePathStyle: config.forcePathStyle === true || config.forcePathStyle === 'true' || config.forcePathStyle === '1',
    // Without keys the SDK's own chain (environment, instance role) is used.
    credentials: config.accessKeyId ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } : undefined,
    // Checksums only where S3 requires them: not every S3-compatible store knows the newer headers.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
  })
}

/** Objects in an S3-compatible bucket; `move` is a copy and a delete. */
export function s3Storage(config: S3StorageConfig, client = s3Client(config)): BlobStorage {
  const Bucket = config.bucket
  if (!Bucket) throw new Error('NUXT_STORAGE_BUCKET must name the bucket when NUXT_STORAGE_DRIVER is s3.')
  const orNull = async <T>(work: () => Promise<T>): Promise<T | null> => {
    try {
      return await work()
    }
    catch (error) {
      if (notFound(error)) return null
      throw error
    }
  }
  return {
    async put(key, bytes, contentType) {
      checkKey(key)
      const sha256 = createHash('sha256').update(bytes).digest('hex')
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, Metadata: { [SHA256_METADATA]: sha256 } }))
    },
    async get(key) {
      checkKey(key)
      return orNull(async () => {
        const reply = await client.send(new GetObjectCommand({ Bucket, Key: key }))
        return reply.Body ? await reply.Body.transformToByteArray() : new Uint8Array()
      })
    },
    async head(key) {
      checkKey(key)
      return orNull(async () => {
        const reply = await client.send(new HeadObjectCommand({ Bucket, Key: key }))
        return { size: reply.ContentLength ?? 0, modifiedAt: reply.LastModified ?? new Date(0) }
      })
    },
    async stream(key, range) {
      checkKey(key)
      return orNull(async () => {
        const reply = await client.send(new GetObjectCommand({ Bucket, Key: key, Range: range ? `bytes=${range.start}-${range.end}` : undefined }))
        if (reply.Body instanceof Readable) return reply.Body
        return Readable.from([reply.Body ? await reply.Body.transformToByteArray() : new Uint8Array()])
      })
    },
    async delete(key) {
      checkKey(key)
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }))
    },
    async move(from, to) {
      checkKey(from)
      checkKey(to)
      const copied = await orNull(() => client.send(new CopyObjectCommand({ Bucket, Key: to, CopySource: `${Bucket}/${from}` })))
      if (!copied) return false
      await client.send(new DeleteObjectCommand({ Bucket, Key: from }))
      return true
    },
    async list(prefix) {
      checkPrefix(prefix)
      const found: StoredObject[] = []
      let ContinuationToken: string | undefined
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix === '' || prefix.endsWith('/') ? prefix : `${prefix}/`, ContinuationToken }))
        for (const object of page.Contents ?? []) {
          if (object.Key) found.push({ key: object.Key, modifiedAt: object.LastModified ?? new Date(0) })
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined
      } while (ContinuationToken)
      return found
    },
    async clearUnfinished(prefix) {
      // A PUT is whole or absent: nothing is left half written; the prefix is still checked.
      checkPrefix(prefix)
      return []
    },
    async ping() {
      await client.send(new HeadBucketCommand({ Bucket }))
    },
  }
}
