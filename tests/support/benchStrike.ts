import { noteToFrequencyHz } from '../../shared/analysis/noteToFrequencyHz'
import { synthStrike } from './synthStrike'
import { writeWav } from './writeWav'

/**
 * A synthetic marimba-like strike of a note for the Bench tests and benchmark: partials at
 * 1, 4 and 10 times the target with chosen detunings, a quiet lead-in and a long ring.
 * The truth of each partial's cents is the synthesis itself.
 */
export function benchStrikeWav(note: string, options: { centsByPartial?: [number, number, number], leadInS?: number, ringS?: number, sampleRate?: number, referenceHz?: number, seed?: number } = {}) {
  const sampleRate = options.sampleRate ?? 48000
  const target = noteToFrequencyHz(note, options.referenceHz ?? 440)
  const [c1, c2, c3] = options.centsByPartial ?? [0, 0, 0]
  const leadInS = options.leadInS ?? 0.6
  const samples = synthStrike([
    { frequencyHz: target * 2 ** (c1 / 1200), amplitudeDb: -8, decayDbPerS: 12 },
    { frequencyHz: 4 * target * 2 ** (c2 / 1200), amplitudeDb: -18, decayDbPerS: 22 },
    { frequencyHz: 10 * target * 2 ** (c3 / 1200), amplitudeDb: -26, decayDbPerS: 35 },
  ], { sampleRate, durationS: leadInS + (options.ringS ?? 3.4), onsetS: leadInS, noiseDb: -78, seed: options.seed ?? 11 })
  return writeWav([samples], sampleRate, 'pcm16')
}
