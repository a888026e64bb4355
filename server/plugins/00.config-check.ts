/**
 * Refuses to start a production server that would be unsafe: without an auth
 * secret (sessions would be signed with an empty key), with a development-only
 * feature switched on by the environment, or with storage it could never use.
 */
export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  const production = process.env.NODE_ENV === 'production'
  if (production && config.public.devMailbox) {
    console.error('Tonewright cannot start: the Mailbox is for development only; remove NUXT_PUBLIC_DEV_MAILBOX from the environment of a production start and read caught mail with `npm run mailbox`.')
    process.exit(1)
  }
  const storage = config.storage as { driver: string, bucket: string }
  if (storage.driver !== 'fs' && storage.driver !== 's3') {
    console.error(`Tonewright cannot start: NUXT_STORAGE_DRIVER is "${storage.driver}"; use fs (files under NUXT_STORAGE_DIR) or s3.`)
    process.exit(1)
  }
  if (storage.driver === 's3' && !storage.bucket) {
    console.error('Tonewright cannot start: NUXT_STORAGE_DRIVER is s3 but NUXT_STORAGE_BUCKET names no bucket.')
    process.exit(1)
  }
  if (!config.authSecret || String(config.authSecret).length < 16) {
    if (production) {
      console.error('Tonewright cannot start: set NUXT_AUTH_SECRET to a random string of at least 16 characters.')
      process.exit(1)
    }
    console.warn('Tonewright: NUXT_AUTH_SECRET is not set; using a development-only secret.')
    config.authSecret = 'development-only-secret-not-for-production'
  }
})
