import { parseTrustedProxies } from '../utils/client-address'

/**
 * A mistyped NUXT_TRUSTED_PROXIES would make every client one address (or let
 * clients choose theirs): production refuses to start with one.
 */
export default defineNitroPlugin(() => {
  try {
    parseTrustedProxies(String(useRuntimeConfig().trustedProxies ?? ''))
  }
  catch (error) {
    console.error(`Tonewright cannot start: ${(error as Error).message}`)
    if (process.env.NODE_ENV === 'production') process.exit(1)
  }
})
