// The reference partials of a recording by the rules of tests/fixtures/real/README.md:
// of the plain reading's peaks within 30 dB of the strongest, a peak closer than
// max(15 Hz, 1 %) to a stronger one is its sideband or lobe, and so is a peak up to 50 Hz
// from a stronger one with a mirror image on the other side, within 10 % of the offset (a
// modulation's pair, as the patch loops of the README's xylophone-c6); of the rest, the three lowest of the five strongest. Used to read many recordings without a hand at each.
import { referenceReading, type ReadingPeak } from './referenceReading'

export const READING_RANGE_DB = 30
export const READING_STRONGEST = 5
export const READING_KEPT = 3

/** Samples and rate of a plain 16-bit PCM WAV file (the fixture caches hold only these). */
export function readPcm16Wav(bytes: Uint8Array): { samples: Float64Array, sampleRate: number, channels: number } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  let offset = 12
  let sampleRate = 0
  let channels = 1
  while (offset + 8 <= bytes.byteLength) {
    const id = String.fromCharCode(...bytes.subarray(offset, offset + 4))
    const size = view.getUint32(offset + 4, true)
    if (id === 'fmt ') {
      channels = view.getUint16(offset + 10, true)
      sampleRate = view.getUint32(offset + 12, true)
      if (view.getUint16(offset + 22, true) !== 16) throw new Error('only 16-bit PCM WAV files are read here')
    }
    else if (id === 'data') {
      const frames = Math.floor(Math.min(size, bytes.byteLength - offset - 8) / (2 * channels))
      const samples = new Float64Array(frames)
      for (let i = 0; i < frames; i++) {
        let sum = 0
        for (let c = 0; c < channels; c++) sum += view.getInt16(offset + 8 + 2 * (i * channels + c), true)
        samples[i] = sum / channels / 32768
      }
      return { samples, sampleRate, channels }
    }
    offset += 8 + size + (size & 1)
  }
  throw new Error('no data chunk in the WAV file')
}

/** The peaks that count as partials, strongest first (sidebands and lobes left out). */
export function readingPartials(samples: Float64Array, sampleRate: number): ReadingPeak[] {
  const peaks = referenceReading(samples, sampleRate)
  if (peaks.length === 0) return []
  const top = peaks[0]!.amplitudeDb
  const kept: ReadingPeak[] = []
  for (const p of peaks) {
    if (p.amplitudeDb < top - READING_RANGE_DB) break
    if (kept.some(k => Math.abs(k.frequencyHz - p.frequencyHz) < Math.max(15, 0.01 * k.frequencyHz))) continue
    if (kept.some(k => isMirrored(peaks, k.frequencyHz, p.frequencyHz))) continue
    kept.push(p)
  }
  return kept
}

function isMirrored(peaks: readonly ReadingPeak[], carrierHz: number, frequencyHz: number): boolean {
  const offsetHz = frequencyHz - carrierHz
  if (Math.abs(offsetHz) > 50) return false
  const mirrorHz = carrierHz - offsetHz
  return peaks.some(q => Math.abs(q.frequencyHz - mirrorHz) < Math.max(1, 0.1 * Math.abs(offsetHz)))
}

/** The three lowest of the five strongest partials, lowest first. */
export function referencePartials(samples: Float64Array, sampleRate: number): ReadingPeak[] {
  return readingPartials(samples, sampleRate)
    .slice(0, READING_STRONGEST)
    .sort((a, b) => a.frequencyHz - b.frequencyHz)
    .slice(0, READING_KEPT)
}
