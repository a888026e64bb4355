import { createDatabase, type Database } from '../database/client'

let instance: ReturnType<typeof createDatabase> | undefined

/** The process's connection pool (lazily opened from runtime config). */
export function useDatabase(): Database {
  if (!instance) instance = createDatabase(useRuntimeConfig().databaseUrl)
  return instance.db
}

/** The raw postgres.js client, for health checks. */
export function useSqlClient() {
  useDatabase()
  return instance!.client
}
