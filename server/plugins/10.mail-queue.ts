import { certificatePdfJob } from '../utils/certificate-pdf-job'
import { closePdfPool } from '../utils/certificate-pdf-pool'
import { MailQueue, kickMailQueue, setMailQueue } from '../utils/mail-queue'

/**
 * Starts the mail worker (and the certificate PDF job on the same queue) beside the
 * web server. Start-up does not wait for it and a queue that cannot start never
 * stops the app: it logs a clear line and tries again.
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
    leaseS: Number(config.mailLeaseS),
    // A rendered PDF may release certificate e-mails that wait for it.
    jobs: [certificatePdfJob(useDatabase(), useBlobStorage(), () => kickMailQueue())],
  })
  setMailQueue(queue)
  void queue.start()
  nitroApp.hooks.hook('close', async () => {
    setMailQueue(null)
    await queue.stop()
    await closePdfPool()
  })
})
