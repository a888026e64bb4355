import { tonalityDb } from './tonalityDb'
import { energyBlockLength } from './units'

/** Where the strike is in a recording, in samples. */
export interface StrikeSpan {
  /** First sample of the strike. */
  onsetIndex: number
  /** First sample analysed: onset plus the skipped attack transient. */
  startIndex: number
  /** One past the last sample above the noise floor. */
  endIndex: number
  /** Level of the quiet parts of the recording, dB re full scale (RMS). */
  noiseFloorDb: number
  /** Level of the loudest block, dB re full scale (RMS). */
  peakDb: number
  /** First sample of the loudest block. */
  peakIndex: number
}

export interface StrikeSettings {
  /** Time skipped after the onset, in s (the attack transient of mallet contact). */
  attackSkipS: number
  /** Length of the energy blocks, in s. */
  blockS?: number
}

/** The lead-in before the strike ends at the first block this close to the loudest, dB. */
const LEAD_IN_BELOW_PEAK_DB = 20

/**
 * Find the strike in a mono recording from its short-time energy envelope (1 ms
 * blocks; digital silence, a block of one repeated value, is no part of the recording's floor):
 * the noise floor is the median level of the lead-in before the first block within 20 dB of the
 * loudest (or the 10th percentile of all blocks when that is lower or there is no lead-in), the onset is
 * the first sample of the rise to the loudest block (the first sample over
 * max(4 × noise RMS, peak − 30 dB) from the block where the envelope left the floor and the
 * lead-in's level over 20 ms by 10 dB),
 * and the end is the last point where the smoothed envelope stands 6 dB over the floor — or, with
 * no lead-in, the recording's last sound when it stops while the piece still rings (stillRingingTo).
 */
export function findStrike(signal: Float64Array, sampleRate: number, settings: StrikeSettings): StrikeSpan {
  const block = energyBlockLength(sampleRate, settings.blockS)
  const blocks = Math.floor(signal.length / block)
  if (blocks < 4) throw new RangeError('findStrike needs at least four blocks of signal')
  const levels = new Float64Array(blocks)
  const energies = new Float64Array(blocks)
  // Digital silence (a block of one repeated value: an editor's zeros before or after the
  // sound, shifted by the DC removal) holds no noise to read a floor from.
  const silent = new Uint8Array(blocks)
  const sounding: number[] = []
  for (let b = 0; b < blocks; b++) {
    let e = 0
    for (let i = b * block; i < (b + 1) * block; i++) e += signal[i]! * signal[i]!
    energies[b] = e / block
    levels[b] = 10 * Math.log10(e / block + 1e-30)
    silent[b] = isSilent(signal, b, block) ? 1 : 0
    if (!silent[b]) sounding.push(levels[b]!)
  }
  let peakBlock = 0
  for (let b = 1; b < blocks; b++) if (levels[b]! > levels[peakBlock]!) peakBlock = b
  const peakDb = levels[peakBlock]!
  // The quiet part is the lead-in before the strike when there is one (a ringing piece may
  // never fall to the floor within the recording), else the quietest tenth of the blocks. The
  // lead-in ends where the sound first comes near its loudest: under a deep slow tremolo the
  // loudest block may be a later swell, and what lies before it is the strike, not the floor.
  let noiseFloorDb = percentile(sounding.length > 0 ? Float64Array.from(sounding) : levels, 0.1)
  let firstLoud = 0
  while (levels[firstLoud]! < peakDb - LEAD_IN_BELOW_PEAK_DB) firstLoud++
  // The lead-in starts where the recording does: silence an editor put before it is no part of it.
  let leadStart = 0
  while (leadStart < firstLoud && silent[leadStart]) leadStart++
  // The rise must also clear the lead-in's own level over 20 ms: 1 ms blocks of mains hum or
  // rumble dip 20 dB at its zero crossings, and a floor read from those dips puts the onset in the hum.
  let leadInDb = -Infinity
  if (firstLoud - leadStart >= 15) {
    noiseFloorDb = Math.min(noiseFloorDb, percentile(levels.subarray(leadStart, firstLoud - 5), 0.5))
    leadInDb = percentile(smoothedLevels(energies.subarray(leadStart, firstLoud - 5), FLOOR_BLOCKS), 0.5)
  }
  const riseDb = Math.max(noiseFloorDb + 10, leadInDb + 10, peakDb - 40)

  // Walk back from the loudest block to where the envelope left the floor. A low partial
  // dips at its zero crossings within a block, so only a run of 20 quiet blocks (20 ms)
  // counts as the floor before the strike.
  let first = peakBlock
  let quiet = 0
  for (let b = peakBlock - 1; b >= 0 && quiet < 20; b--) {
    if (levels[b]! > riseDb) {
      first = b
      quiet = 0
    }
    else quiet++
  }
  const threshold = Math.max(4 * 10 ** (noiseFloorDb / 20), 10 ** ((peakDb - 30) / 20))
  let onsetIndex = first * block
  const searchFrom = Math.max(0, (first - 1) * block)
  for (let i = searchFrom; i < (peakBlock + 1) * block; i++) {
    if (Math.abs(signal[i]!) > threshold) {
      onsetIndex = i
      break
    }
  }

  // Smooth over 10 blocks so a single noisy block does not extend the strike.
  const smooth = 10
  const endPower = 10 ** ((noiseFloorDb + 6) / 10)
  const prefix = new Float64Array(blocks + 1)
  for (let b = 0; b < blocks; b++) prefix[b + 1] = prefix[b]! + energies[b]!
  let last = blocks - 1
  for (; last > peakBlock; last--) {
    const from = Math.max(peakBlock, last - smooth + 1)
    if ((prefix[last + 1]! - prefix[from]!) / (last - from + 1) > endPower) break
  }
  // Without a lead-in the floor is the quietest tenth of the recording: the piece itself when the
  // take stops while it still rings, and the strike would end where it began. Such a recording's
  // level still falls over its last quarter, where a floor holds level: the strike runs to its end.
  const ringsTo = firstLoud - leadStart < 15 ? stillRingingTo(signal, { prefix, silent, block }, peakBlock, { noiseFloorDb, peakDb }) : null
  if (ringsTo !== null) last = ringsTo - 1
  const endIndex = Math.min(signal.length, (last + 1) * block)
  const startIndex = Math.min(endIndex, onsetIndex + Math.round(settings.attackSkipS * sampleRate))
  return { onsetIndex, startIndex, endIndex, noiseFloorDb, peakDb, peakIndex: peakBlock * block }
}

/** A level still falling between the halves of the last quarter after the peak, dB (a floor's holds within a fraction of this). */
const STILL_FALLING_DB = 0.5

/** A take whose last 20 ms are within this of its loudest block stopped while the piece still sounded, dB. */
const STILL_LOUD_WITHIN_DB = 50

/** A decay that falls this many times faster at the end than before is a fade-out or a synthesiser's release, not a piece ringing. */
const MAX_STEEPENING = 2

/** A ringing tail's strongest line stands this far over its median bin, dB (noise's about 10 to 20: tonalityDb). */
const RINGING_TONALITY_DB = 30

/**
 * Where the recording's sound ends, in blocks, when it ends while the sound still rings (else null):
 * after the loudest block and before any digital silence at the end, its last 20 ms are at the floor's level (within 3 dB: not faded out
 * under it) and within 50 dB of the loudest block (a sound that has died away that far has met its
 * floor, whatever lingers), the second half of its last quarter is at least 0.5 dB under the first
 * (a floor holds level) and falls no more than twice as fast as the half-quarter before (a fade-out
 * steepens), and that end holds lines, not noise (tonalityDb: a background faded out falls too).
 */
function stillRingingTo(
  signal: Float64Array,
  /** The blocks' energies as running sums (prefix[b] = Σ energies before b), their silence marks and length. */
  blocks: { prefix: Float64Array, silent: Uint8Array, block: number },
  peakBlock: number,
  levels: { noiseFloorDb: number, peakDb: number },
): number | null {
  const { prefix, silent, block } = blocks
  const { noiseFloorDb, peakDb } = levels
  let end = silent.length
  while (end > peakBlock + 1 && silent[end - 1]) end--
  const quarter = Math.floor((end - peakBlock - 1) / 4)
  if (quarter < 20) return null
  const levelDb = (from: number, count: number) => 10 * Math.log10((prefix[from + count]! - prefix[from]!) / count + 1e-30)
  const finalDb = levelDb(end - 20, 20)
  if (finalDb < noiseFloorDb - 3 || finalDb < peakDb - STILL_LOUD_WITHIN_DB) return null
  const half = quarter >> 1
  const fallDb = levelDb(end - 2 * half, half) - levelDb(end - half, half)
  const fallBeforeDb = levelDb(end - 4 * half, half) - levelDb(end - 3 * half, half)
  if (fallDb <= STILL_FALLING_DB || fallDb > MAX_STEEPENING * Math.max(fallBeforeDb, STILL_FALLING_DB)) return null
  const length = Math.min(8192, 2 ** Math.floor(Math.log2(quarter * block)))
  return tonalityDb(signal.subarray(end * block - length, end * block)) > RINGING_TONALITY_DB ? end : null
}

/** Whether block `b` holds one value repeated (digital silence). */
function isSilent(signal: Float64Array, b: number, block: number): boolean {
  const first = signal[b * block]!
  for (let i = b * block + 1; i < (b + 1) * block; i++) if (signal[i] !== first) return false
  return true
}

/** Blocks averaged for the lead-in's level: a period of 50 Hz mains. */
const FLOOR_BLOCKS = 20

/** Level of the mean energy of each block and the `span − 1` before it (fewer at the start), dB. */
function smoothedLevels(energies: Float64Array, span: number): Float64Array {
  const out = new Float64Array(energies.length)
  let sum = 0
  for (let b = 0; b < energies.length; b++) {
    sum += energies[b]!
    if (b >= span) sum -= energies[b - span]!
    out[b] = 10 * Math.log10(Math.max(sum, 0) / Math.min(b + 1, span) + 1e-30)
  }
  return out
}

function percentile(values: Float64Array, q: number): number {
  const sorted = Float64Array.from(values).sort()
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!
}
