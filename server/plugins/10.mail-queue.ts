import { MailQueue, setMailQueue } from '../utils/mail-queue'

/**
 * Starts the mail worker beside the web server. Start-up does not wait for it and
 * a queue that cannot start never stops the app: it logs a clear line and tries again.
 */
export default defineNitroPlugin((nitroApp) => {
  if (import.meta.prerender) return
  const config = useRuntimeConfig()
  const retry = config.mailRetry as { limit: number | string, delayS: number | string }
  const queue = new MailQueue({
    db: useDatabase(),
    storage: useBlobStorage(),
    databaseUrl: config.databaseUrl,
    smtp: config.smtp as { host: string, port: number, user: string, pass: string, from: string },
    retryLimit: Number(retry.limit),
    retryDelayS: Number(retry.delayS),
  })
  setMailQueue(queue)
  void queue.start()
  nitroApp.hooks.hook('close', async () => {
    setMailQueue(null)
    await queue.stop()
  })
})
