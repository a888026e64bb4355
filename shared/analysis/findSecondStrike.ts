import { energyBlockLength } from './units'

/** What makes a rise of the envelope a new blow rather than a tremolo or a beat coming back. */
export interface SecondStrikeSettings {
  /** Rise of the next 3 ms over the 30 ms before them, dB (a blow rises within a few ms). */
  minRiseDb: number
  /** The new blow's level within this much of the strike's loudest block, dB. */
  withinPeakDb: number
}

const BEFORE_BLOCKS = 30
const AFTER_BLOCKS = 3

/**
 * The first sample of a second blow after the strike's start, or null. A blow (a second
 * strike, a mallet's bounce) lifts the short-time energy by many dB within its first
 * milliseconds, while a tremolo (2–10 Hz) or a beating pair comes back out of its trough over
 * tens of ms: the mean energy of the 3 ms after each 1 ms block is compared with the 30 ms
 * before it (an energy onset detector; source: Bello et al., "A tutorial on onset detection in
 * music signals", IEEE Trans. Speech and Audio Processing 13(5), 2005, §III-A). The energy is
 * of the first difference (a high-frequency weighting, ibid. §III-A.1): a new blow brings
 * back the fast-dying high partials and the contact noise, which the first strike has lost,
 * so it stands out far more than in the plain energy. Searched from `fromIndex` (after the
 * attack) to `toIndex`; the loudest block from `onsetIndex` on is the level a blow is judged by.
 */
export function findSecondStrike(
  signal: Float64Array,
  sampleRate: number,
  span: { onsetIndex: number, fromIndex: number, toIndex: number },
  settings: SecondStrikeSettings = { minRiseDb: 12, withinPeakDb: 25 },
): number | null {
  const block = energyBlockLength(sampleRate)
  const onset = Math.max(1, span.onsetIndex)
  const blocks = Math.floor((Math.min(signal.length, span.toIndex) - onset) / block)
  const first = Math.ceil((span.fromIndex - onset) / block) + BEFORE_BLOCKS
  if (blocks < first + AFTER_BLOCKS) return null
  const prefix = new Float64Array(blocks + 1)
  let loudest = 0
  for (let b = 0; b < blocks; b++) {
    let e = 0
    for (let i = onset + b * block; i < onset + (b + 1) * block; i++) e += (signal[i]! - signal[i - 1]!) ** 2
    prefix[b + 1] = prefix[b]! + e / block
    loudest = Math.max(loudest, e / block)
  }
  const rise = 10 ** (settings.minRiseDb / 10)
  const loud = loudest * 10 ** (-settings.withinPeakDb / 10)
  for (let b = Math.max(BEFORE_BLOCKS, first); b + AFTER_BLOCKS <= blocks; b++) {
    const before = (prefix[b]! - prefix[b - BEFORE_BLOCKS]!) / BEFORE_BLOCKS
    const after = (prefix[b + AFTER_BLOCKS]! - prefix[b]!) / AFTER_BLOCKS
    if (after > loud && after > rise * before) {
      // The blow's own block: the first of the three that alone rises that far.
      let k = b
      while (k < b + AFTER_BLOCKS - 1 && prefix[k + 1]! - prefix[k]! <= rise * before) k++
      return onset + k * block
    }
  }
  return null
}
