import { AnalysisError } from './AnalysisError'

/** When the measurement under way must stop, ms on performance.now()'s clock (Infinity: none under way). */
let deadlineMs = Infinity
let limitS = 0

/**
 * Starts the time limit of one measurement (analyzeChannels runs synchronously, so one limit per
 * thread is one per measurement; an earlier limit already running stays) and returns the function
 * that restores the one before. A recording made to
 * be slow — dense noise read as hundreds of partials — is then refused in plain words instead of
 * holding a worker thread.
 */
export function startWorkDeadline(maxS: number): () => void {
  if (!(maxS > 0)) throw new RangeError('startWorkDeadline needs a positive time limit')
  const previous = { deadlineMs, limitS }
  // A limit already running that ends sooner stays (a caller may set a tighter one).
  const endMs = performance.now() + maxS * 1000
  if (endMs < deadlineMs) {
    deadlineMs = endMs
    limitS = maxS
  }
  return () => {
    deadlineMs = previous.deadlineMs
    limitS = previous.limitS
  }
}

/** Throws the engine's 422 when the measurement under way has run past its limit (called between partials). */
export function checkWorkDeadline(): void {
  if (performance.now() <= deadlineMs) return
  throw new AnalysisError(422, 'too_slow_to_measure', `Measuring this recording took longer than ${limitS} s and was stopped: it holds far more partials than a struck piece; record a single strike in a quiet room and send it again.`)
}
