// Seeds the invented demo workshop once (skipped when its owner already exists).
import { seedDemo } from '../server/database/seeds/demo'
import { storageConfigFromEnv, storageFromConfig } from '../server/utils/blob-storage'
import { withScriptDatabase } from './with-database'

await withScriptDatabase({ purpose: 'to seed', missingCode: 1, failed: message => `The demo data could not be seeded: ${message}` }, async (db) => {
  const started = Date.now()
  // The start and test scripts set NUXT_SITE_URL: the demo certificate's verification link points there.
  const siteUrl = process.env.NUXT_SITE_URL || `http://127.0.0.1:${process.env.PORT || 3000}`
  const result = await seedDemo(db, storageFromConfig(storageConfigFromEnv()), siteUrl)
  console.log(result.created ? `Demo workshop "${result.workshopName}" seeded in ${((Date.now() - started) / 1000).toFixed(1)} s.` : 'Demo workshop already present.')
})
