import type { BlobStorage } from './storage'

/** True when PostgreSQL answers a trivial query within two seconds. */
export async function databaseAnswers(): Promise<boolean> {
  const client = useSqlClient()
  try {
    await Promise.race([
      client`select 1`,
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2000)),
    ])
    return true
  }
  catch {
    return false
  }
}

/** True when the object store (strike audio, certificate PDFs) answers within two seconds. */
export async function storageAnswers(storage: BlobStorage): Promise<boolean> {
  try {
    await Promise.race([
      storage.ping(),
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2000)),
    ])
    return true
  }
  catch {
    return false
  }
}
