// Random realistic strikes through the engine: a bar, plate or bell of a random note, rate,
// room, mallet, noise, hum, tremolo and stereo pair (the far microphone up to 2 ms later), each
// measured with and without its target. Prints every partial read more than 1 ¢ off, worse with
// a target than without, or further off than 3 times its own uncertainty, and the counts.
//   npx tsx scripts/sweep-random-strikes.ts [--seed 1] [--count 50]
// Ratios: marimba and vibraphone 1 : 4 : 10, xylophone 1 : 3 : 6 (source: Rossing, Science of
// Percussion Instruments, 2000, ch. 3); glockenspiel as a free–free beam 1 : 2.76 : 5.40 (source:
// Euler–Bernoulli beam, βL = 4.730, 7.853, 10.996); a bell's hum, prime, tierce, quint and nominal
// 0.5 : 1 : 1.2 : 1.5 : 2 (common practice). Decay ranges and levels: from memory.
import { analyzeChannels, centsBetween, type MeasuredPartial } from '../shared/analysis/index'
import { seededRandom } from '../shared/synthesis/seededRandom'
import { synthRealisticStrike, type RealisticOptions, type RealisticPartial } from '../shared/synthesis/synthRealisticStrike'

interface Family { name: string, ratios: number[], lowHz: number, highHz: number, decayDbPerS: [number, number][], tremolo: boolean }

const FAMILIES: Family[] = [
  { name: 'marimba', ratios: [1, 4, 10], lowHz: 55, highHz: 1400, decayDbPerS: [[2, 8], [8, 30], [20, 80]], tremolo: false },
  { name: 'vibraphone', ratios: [1, 4, 10], lowHz: 174, highHz: 1400, decayDbPerS: [[1, 4], [4, 15], [15, 50]], tremolo: true },
  { name: 'xylophone', ratios: [1, 3, 6], lowHz: 349, highHz: 2100, decayDbPerS: [[15, 60], [100, 300], [300, 600]], tremolo: false },
  { name: 'glockenspiel', ratios: [1, 2.76, 5.4], lowHz: 784, highHz: 4200, decayDbPerS: [[5, 20], [20, 80], [60, 200]], tremolo: false },
  { name: 'bell', ratios: [0.5, 1, 1.2, 1.5, 2], lowHz: 300, highHz: 1500, decayDbPerS: [[1, 3], [2, 5], [3, 8], [3, 8], [4, 10]], tremolo: false },
]

const args = process.argv.slice(2)
const option = (name: string, fallback: number) => (args.includes(name) ? Number(args[args.indexOf(name) + 1]) : fallback)
const random = seededRandom(option('--seed', 1))
const count = option('--count', 50)
const between = (lo: number, hi: number) => lo + (hi - lo) * random.uniform()
const chance = (p: number) => random.uniform() < p

interface Reading { errorCents: number, uncertaintyCents: number | null, levelDb: number }

function readingOf(partials: readonly MeasuredPartial[], truth: RealisticPartial): Reading {
  if (partials.length === 0) return { errorCents: Infinity, uncertaintyCents: null, levelDb: Number.NaN }
  const q = partials.reduce((a, b) => (Math.abs(centsBetween(b.frequencyHz, truth.frequencyHz)) < Math.abs(centsBetween(a.frequencyHz, truth.frequencyHz)) ? b : a))
  return { errorCents: Math.abs(centsBetween(truth.frequencyHz, q.frequencyHz)), uncertaintyCents: q.uncertaintyCents, levelDb: q.amplitudeDb - truth.amplitudeDb }
}

const shown = (r: Reading) => `${r.errorCents.toFixed(3)} ¢ ±${r.uncertaintyCents ?? '–'} ${r.levelDb.toFixed(1)} dB`
const counts = { partials: 0, off: 0, worse: 0, overconfident: 0 }

for (let k = 0; k < count; k++) {
  const family = FAMILIES[Math.floor(random.uniform() * FAMILIES.length)]!
  const targetHz = family.lowHz * (family.highHz / family.lowHz) ** random.uniform()
  const sampleRate = [44100, 48000, 96000][Math.floor(random.uniform() * 3)]!
  const partials: RealisticPartial[] = family.ratios.map((ratio, i) => ({
    frequencyHz: targetHz * ratio * (1 + between(-0.004, 0.004)),
    amplitudeDb: -6 - (family.name === 'bell' ? between(0, 12) : 8 * i + between(0, 6)),
    decayDbPerS: between(...family.decayDbPerS[i]!),
    ...(family.tremolo && chance(0.6) ? { tremolo: { rateHz: between(2, 9), index: between(0.2, 0.8) * (i === 0 ? 1 : 0.4), phaseRad: between(0, 2 * Math.PI) } } : {}),
  })).filter(p => p.frequencyHz < Math.min(19000, 0.45 * sampleRate)) // the engine reads up to 20 kHz
  const options: RealisticOptions = {
    sampleRate, durationS: between(1.2, 4), onsetS: between(0, 0.8), seed: k + 1, noiseDb: between(-85, -60),
    room: chance(0.6) ? { t60S: between(0.3, 1.2), wetDb: between(-32, -18) } : undefined,
    mallet: chance(0.7) ? { levelDb: between(-26, -12), durationS: between(0.001, 0.01) } : undefined,
    hum: chance(0.2) ? { frequencyHz: chance(0.5) ? 50 : 60, levelDb: between(-60, -40) } : undefined,
  }
  const x = synthRealisticStrike(partials, options)
  const delay = chance(0.3) ? Math.round(between(0, 0.002) * sampleRate) : null
  const channels = delay === null ? [x] : [x, Float64Array.from(x, (_, i) => (i >= delay ? 0.8 * x[i - delay]! : 0))]
  const without = analyzeChannels(channels, sampleRate, {}).partials
  const withTarget = analyzeChannels(channels, sampleRate, { targetHz, ratios: family.ratios }).partials
  partials.forEach((truth) => {
    counts.partials++
    const [a, b] = [readingOf(without, truth), readingOf(withTarget, truth)]
    const flags: string[] = []
    const flag = (when: boolean, what: string, key: 'off' | 'worse' | 'overconfident') => {
      if (!when) return
      flags.push(what)
      counts[key]++
    }
    flag(a.errorCents > 1 || b.errorCents > 1, 'off by more than 1 ¢', 'off')
    flag(b.errorCents > a.errorCents + 0.1, 'worse with a target', 'worse')
    flag(b.errorCents < 5 && b.uncertaintyCents !== null && b.errorCents > 3 * b.uncertaintyCents + 0.05, 'over 3 uncertainties', 'overconfident')
    if (flags.length === 0) return
    const setup = [`${sampleRate / 1000} kHz`, delay === null ? 'mono' : `stereo, ${delay} samples later`, options.room ? 'room' : '', options.hum ? 'hum' : ''].filter(Boolean).join(', ')
    console.log(`#${k} ${family.name} ${targetHz.toFixed(1)} Hz (${setup}): ${truth.frequencyHz.toFixed(1)} Hz, ${truth.amplitudeDb.toFixed(1)} dB, ${truth.decayDbPerS.toFixed(0)} dB/s${truth.tremolo ? ', tremolo' : ''} — no target ${shown(a)}; target ${shown(b)} — ${flags.join(', ')}`)
  })
}
console.log(`${count} strikes, ${counts.partials} partials: ${counts.off} read more than 1 ¢ off, ${counts.worse} worse with a target, ${counts.overconfident} further off than 3 uncertainties`)
