import { createDatabase, type Database } from '../server/database/client'

export interface ScriptDatabaseOptions {
  /** What the database is for, ending the sentence "Set NUXT_DATABASE_URL to the PostgreSQL database …". */
  purpose: string
  /** The exit code when NUXT_DATABASE_URL is missing. */
  missingCode: number
  /** The plain sentence printed for a failure's message (no stack trace); the script then exits 1. */
  failed: (message: string) => string
  max?: number
}

/** Runs a command-line script's work on the database in NUXT_DATABASE_URL and always closes the connection. */
export async function withScriptDatabase(options: ScriptDatabaseOptions, work: (db: Database) => Promise<void>) {
  const url = process.env.NUXT_DATABASE_URL
  if (!url) {
    console.error(`Set NUXT_DATABASE_URL to the PostgreSQL database ${options.purpose}.`)
    process.exit(options.missingCode)
  }
  const { db, client } = createDatabase(url, { max: options.max ?? 2 })
  try {
    await work(db)
  }
  catch (error) {
    console.error(options.failed((error as Error).message))
    process.exitCode = 1
  }
  finally {
    await client.end()
  }
}
