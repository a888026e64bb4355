import { blackmanHarris } from './blackmanHarris'

/** Windows kept at once: an analysis uses a few dozen (length, period) pairs, most of them many times. */
const KEPT = 48
const windows = new Map<string, Float64Array>()

/**
 * The periodic 4-term Blackman–Harris window (blackmanHarris, Harris 1978) of `length`
 * samples and span `period`, made once and shared: the short-time frames and the band
 * windows ask for the same few windows hundreds of times per strike. The array is shared
 * between callers, so it must be read only. Least recently used windows are dropped first.
 */
export function cachedBlackmanHarris(length: number, period = length): Float64Array {
  const key = `${length}:${period}`
  let window = windows.get(key)
  if (window) windows.delete(key)
  else window = blackmanHarris(length, period)
  windows.set(key, window)
  if (windows.size > KEPT) windows.delete(windows.keys().next().value!)
  return window
}
