import { useRuntimeConfig } from 'nitropack/runtime'
import { fail } from '../utils/http-errors'

/**
 * The Mailbox's routes are registered only by `nuxt dev` (modules/dev-mailbox.ts);
 * this second check keeps them closed should one ever reach another build.
 */
export function requireDevMailbox(): string {
  const config = useRuntimeConfig()
  if (!import.meta.dev || process.env.NODE_ENV === 'production' || !config.public.devMailbox) {
    fail(404, 'The mailbox exists only in development.')
  }
  return String(config.mailCatcherDir)
}
