// Seeds the invented demo workshop once (skipped when its owner already exists).
import { createDatabase } from '../server/database/client'
import { seedDemo } from '../server/database/seeds/demo'
import { storageConfigFromEnv, storageFromConfig } from '../server/utils/blob-storage'

const url = process.env.NUXT_DATABASE_URL
if (!url) {
  console.error('Set NUXT_DATABASE_URL to the PostgreSQL database to seed.')
  process.exit(1)
}
const { db, client } = createDatabase(url, { max: 2 })
try {
  const started = Date.now()
  const result = await seedDemo(db, storageFromConfig(storageConfigFromEnv()))
  console.log(result.created ? `Demo workshop "${result.workshopName}" seeded in ${((Date.now() - started) / 1000).toFixed(1)} s.` : 'Demo workshop already present.')
}
catch (error) {
  console.error(`The demo data could not be seeded: ${(error as Error).message}`)
  process.exitCode = 1
}
finally {
  await client.end()
}
