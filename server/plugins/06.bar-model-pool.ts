import { closeBarModelPool } from '../utils/bar-model-pool'

/** Stops the bar model's worker thread (started on first use) when the server closes. */
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('close', async () => {
    await closeBarModelPool()
  })
})
