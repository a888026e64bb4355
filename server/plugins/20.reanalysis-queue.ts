import { ReanalysisQueue, setReanalysisQueue } from '../utils/reanalysis-queue'

/** Starts the re-measurement worker beside the web server; like the mail worker, it never stops the app. */
export default defineNitroPlugin((nitroApp) => {
  if (import.meta.prerender) return
  const queue = new ReanalysisQueue({ db: useDatabase(), storage: useBlobStorage(), databaseUrl: useRuntimeConfig().databaseUrl })
  setReanalysisQueue(queue)
  void queue.start()
  nitroApp.hooks.hook('close', async () => {
    setReanalysisQueue(null)
    await queue.stop()
  })
})
