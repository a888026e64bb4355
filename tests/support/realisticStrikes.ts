// Modal-synthesis strikes with what real ones hold (mallet noise, tremolo, doublets,
// fast-dying high modes, a room's tail, mains hum, background noise) and known truth.
// Mode ratios are the families' published or trade values, named beside each.
import { synthRealisticStrike, tremoloDepthDb, type RealisticOptions, type RealisticPartial } from '../../shared/synthesis/synthRealisticStrike'

export interface RealisticCase {
  id: string
  family: string
  targetHz: number
  ratios: number[]
  partials: RealisticPartial[]
  options: RealisticOptions
  /** Hum frequency (not a partial of the strike), Hz, when the case has hum. */
  humHz?: number
}

const base = { sampleRate: 48000, durationS: 3, onsetS: 0.1 }
const mallet = (levelDb: number, durationS: number) => ({ levelDb, durationS })

export const REALISTIC_CASES: RealisticCase[] = [
  {
    // Vibraphone bars are tuned 1 : 4 : 10 (source: Rossing, Science of Percussion Instruments, 2000, ch. 3);
    // the rotating discs modulate the level at a few Hz (common practice: 2–10 Hz).
    id: 'vibraphone-c3-tremolo',
    family: 'vibraphone',
    targetHz: 130.81,
    ratios: [1, 4, 10],
    partials: [
      { frequencyHz: 130.87, amplitudeDb: -8, decayDbPerS: 3, tremolo: { rateHz: 5.5, index: 0.5 } },
      { frequencyHz: 523.0, amplitudeDb: -20, decayDbPerS: 12, tremolo: { rateHz: 5.5, index: 0.5 } },
      { frequencyHz: 1309.4, amplitudeDb: -30, decayDbPerS: 40, tremolo: { rateHz: 5.5, index: 0.5 } },
    ],
    options: { ...base, seed: 31, mallet: mallet(-20, 0.004), hum: { frequencyHz: 50, levelDb: -62 }, room: { t60S: 0.8, wetDb: -25 }, noiseDb: -80 },
    humHz: 50,
  },
  {
    // Marimba bars 1 : 4 : 10 by design, here a little flat on the upper two (source: Rossing 2000, ch. 3).
    id: 'marimba-a3',
    family: 'marimba',
    targetHz: 220,
    ratios: [1, 4, 10],
    partials: [
      { frequencyHz: 220.1, amplitudeDb: -6, decayDbPerS: 10 },
      { frequencyHz: 874.2, amplitudeDb: -18, decayDbPerS: 35 },
      { frequencyHz: 2183.0, amplitudeDb: -28, decayDbPerS: 90 },
    ],
    options: { ...base, seed: 32, mallet: mallet(-18, 0.005), hum: { frequencyHz: 60, levelDb: -65 }, room: { t60S: 0.6, wetDb: -28 }, noiseDb: -78 },
    humHz: 60,
  },
  {
    // Xylophone bars 1 : 3 : 6 (source: Rossing 2000, ch. 3); hard mallet, the ×3 dies in 0.3 s, the ×6 in 0.1 s.
    id: 'xylophone-c5-hard',
    family: 'xylophone',
    targetHz: 523.25,
    ratios: [1, 3, 6],
    partials: [
      { frequencyHz: 523.4, amplitudeDb: -10, decayDbPerS: 40 },
      { frequencyHz: 1572.1, amplitudeDb: -14, decayDbPerS: 200 },
      { frequencyHz: 3180.5, amplitudeDb: -22, decayDbPerS: 600 },
    ],
    options: { ...base, durationS: 2, seed: 33, mallet: mallet(-12, 0.002), room: { t60S: 0.5, wetDb: -30 }, noiseDb: -80 },
  },
  {
    // Glockenspiel bars as free–free beams, 1 : 2.76 : 5.40 (source: Euler–Bernoulli beam, βL = 4.730, 7.853, 10.996).
    id: 'glockenspiel-g6',
    family: 'glockenspiel',
    targetHz: 1567.98,
    ratios: [1, 2.76, 5.4],
    partials: [
      { frequencyHz: 1568.4, amplitudeDb: -10, decayDbPerS: 8 },
      { frequencyHz: 4250.0, amplitudeDb: -24, decayDbPerS: 60 },
      { frequencyHz: 8300.0, amplitudeDb: -30, decayDbPerS: 300 },
    ],
    options: { ...base, seed: 34, mallet: mallet(-16, 0.0015), hum: { frequencyHz: 50, levelDb: -66 }, noiseDb: -82 },
    humHz: 50,
  },
  {
    // A tuned bell: hum 0.5, prime 1, tierce 1.2, quint 1.5, nominal 2 (source: Rossing 2000, ch. 13),
    // prime and nominal split into doublets about 1 Hz apart (common practice: a slightly asymmetric casting).
    id: 'bell-c5-doublets',
    family: 'bell',
    targetHz: 523.25,
    ratios: [0.5, 1, 1.2, 1.5, 2],
    partials: [
      { frequencyHz: 261.5, amplitudeDb: -14, decayDbPerS: 2 },
      { frequencyHz: 523.3, amplitudeDb: -12, decayDbPerS: 4 },
      { frequencyHz: 524.4, amplitudeDb: -20, decayDbPerS: 4.5 },
      { frequencyHz: 627.6, amplitudeDb: -16, decayDbPerS: 6 },
      { frequencyHz: 785.4, amplitudeDb: -24, decayDbPerS: 8 },
      { frequencyHz: 1046.4, amplitudeDb: -10, decayDbPerS: 10 },
      { frequencyHz: 1047.6, amplitudeDb: -19, decayDbPerS: 11 },
    ],
    options: { ...base, durationS: 4, seed: 35, mallet: mallet(-14, 0.001), room: { t60S: 1.2, wetDb: -22 }, noiseDb: -80 },
  },
  {
    // A steel-pan note field tuned 1 : 2 : 4 (source: Rossing 2000, ch. 10; common practice for the tenor pan).
    id: 'steel-drum-c4',
    family: 'steel drum',
    targetHz: 261.63,
    ratios: [1, 2, 4],
    partials: [
      { frequencyHz: 261.7, amplitudeDb: -10, decayDbPerS: 15 },
      { frequencyHz: 523.9, amplitudeDb: -14, decayDbPerS: 20 },
      { frequencyHz: 786.0, amplitudeDb: -34, decayDbPerS: 25 },
      { frequencyHz: 1046.0, amplitudeDb: -20, decayDbPerS: 30 },
    ],
    options: { ...base, seed: 36, mallet: mallet(-20, 0.006), hum: { frequencyHz: 60, levelDb: -60 }, room: { t60S: 0.7, wetDb: -26 }, noiseDb: -76 },
    humHz: 60,
  },
]

export function renderRealisticCase(c: RealisticCase): Float64Array {
  return synthRealisticStrike(c.partials, c.options)
}

/** The three lowest of the five strongest modes within 30 dB of the strongest (the tuned ones). */
export function tunedTruth(partials: readonly RealisticPartial[]): RealisticPartial[] {
  const strongest = Math.max(...partials.map(p => p.amplitudeDb))
  return [...partials]
    .filter(p => p.amplitudeDb >= strongest - 30)
    .sort((a, b) => b.amplitudeDb - a.amplitudeDb)
    .slice(0, 5)
    .sort((a, b) => a.frequencyHz - b.frequencyHz)
    .slice(0, 3)
}

export { tremoloDepthDb }
