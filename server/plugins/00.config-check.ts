/**
 * Refuses to start a production server without an auth secret: sessions would be
 * signed with an empty key.
 */
export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  if (!config.authSecret || String(config.authSecret).length < 16) {
    if (process.env.NODE_ENV === 'production') {
      console.error('Tonewright cannot start: set NUXT_AUTH_SECRET to a random string of at least 16 characters.')
      process.exit(1)
    }
    console.warn('Tonewright: NUXT_AUTH_SECRET is not set; using a development-only secret.')
    config.authSecret = 'development-only-secret-not-for-production'
  }
})
