// Applies the committed, forward-only Drizzle migrations in drizzle/.
import { fileURLToPath } from 'node:url'
import { migrate } from 'drizzle-orm/postgres-js/migrator'
import { withScriptDatabase } from './with-database'

// An absolute folder: the migrator would otherwise resolve it from the working directory.
const migrationsFolder = fileURLToPath(new URL('../drizzle', import.meta.url))
await withScriptDatabase({ purpose: 'to migrate', missingCode: 1, failed: message => `The database migrations could not be applied: ${message}`, max: 1 }, async (db) => {
  await migrate(db, { migrationsFolder })
})
