// Applies the committed, forward-only Drizzle migrations in drizzle/.
import { fileURLToPath } from 'node:url'
import { migrate } from 'drizzle-orm/postgres-js/migrator'
import { createDatabase } from '../server/database/client'

const url = process.env.NUXT_DATABASE_URL
if (!url) {
  console.error('Set NUXT_DATABASE_URL to the PostgreSQL database to migrate.')
  process.exit(1)
}
// An absolute folder: the migrator would otherwise resolve it from the working directory.
const migrationsFolder = fileURLToPath(new URL('../drizzle', import.meta.url))
const { db, client } = createDatabase(url, { max: 1 })
try {
  await migrate(db, { migrationsFolder })
}
catch (error) {
  console.error(`The database migrations could not be applied: ${(error as Error).message}`)
  process.exitCode = 1
}
finally {
  await client.end()
}
