// Seeds the invented demo workshop once (skipped when its owner already exists).
import { seedDemo } from '../server/database/seeds/demo'
import { storageConfigFromEnv, storageFromConfig } from '../server/utils/blob-storage'
import { withScriptDatabase } from './with-database'

await withScriptDatabase({ purpose: 'to seed', missingCode: 1, failed: message => `The demo data could not be seeded: ${message}` }, async (db) => {
  const started = Date.now()
  const result = await seedDemo(db, storageFromConfig(storageConfigFromEnv()))
  console.log(result.created ? `Demo workshop "${result.workshopName}" seeded in ${((Date.now() - started) / 1000).toFixed(1)} s.` : 'Demo workshop already present.')
})
