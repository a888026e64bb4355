import { sweepStrikeUploads } from '../utils/strike-uploads'

/**
 * Clears strike audio whose database row never committed (see recordStrike): once at
 * start, then every `strikeUploadSweep.intervalS`, for pending uploads older than
 * `strikeUploadSweep.olderThanS`. Several instances may run it; an advisory lock lets one sweep at a time.
 */
export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig().strikeUploadSweep as { intervalS: number | string, olderThanS: number | string }
  const intervalMs = Math.max(1, Number(config.intervalS)) * 1000
  const olderThanMs = Math.max(0, Number(config.olderThanS)) * 1000
  let running = false
  const sweep = async () => {
    if (running) return
    running = true
    try {
      const report = await sweepStrikeUploads(useDatabase(), useBlobStorage(), olderThanMs)
      if (report.removed.length + report.promoted.length > 0) {
        console.info(`Tonewright: strike upload sweep removed ${report.removed.length} and promoted ${report.promoted.length} pending recordings.`)
      }
    }
    catch (error) {
      console.error('Tonewright: the strike upload sweep failed; it runs again later.', error instanceof Error ? error.message : error)
    }
    finally {
      running = false
    }
  }
  const first = setTimeout(sweep, 1000)
  const timer = setInterval(sweep, intervalMs)
  first.unref()
  timer.unref()
  nitroApp.hooks.hook('close', () => {
    clearTimeout(first)
    clearInterval(timer)
  })
})
