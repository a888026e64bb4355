// Speed and accuracy figures of the high-resolution estimator (npx tsx scripts/bench-pencil.ts).
// Prints: the time of the cross-check step (annotatePartials) for a 4 s, 48 kHz strike with
// 30+ partials beside the whole engine's time on it; the Cramér–Rao table (RMS error of the
// band estimator vs the bound, per SNR, duration and decay); the separation of close pairs.
// Figures only: the goals are asserted by the unit tests, not here. Pass --quick for fewer
// trials, --only=speed|crb|pairs for one part.
import os from 'node:os'
import { analyzeSamples, annotatePartials, dampedSinusoidCrb, estimateBand, separateDoublet } from '../shared/analysis/index'
import type { FftPartial } from '../shared/analysis/index'
import { seededRandom } from '../shared/synthesis/seededRandom'
import { synthStrike, type SynthPartial } from '../shared/synthesis/synthStrike'
import { DB_PER_NEPER } from '../shared/analysis/units'

const quick = process.argv.includes('--quick')
const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b)
  return s.length % 2 ? s[s.length >> 1]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2
}

/** A 4 s strike of a bar-like piece with 34 partials: decay grows with frequency, levels fall. */
function richStrike(sampleRate: number): { signal: Float64Array, partials: SynthPartial[] } {
  const random = seededRandom(11)
  const partials: SynthPartial[] = []
  let f = 196
  for (let k = 0; k < 34; k++) {
    partials.push({ frequencyHz: f, amplitudeDb: -6 - 1.3 * k - 6 * random.uniform(), decayDbPerS: 3 + f / 120 })
    f *= 1.09 + 0.05 * random.uniform()
  }
  return { signal: synthStrike(partials, { sampleRate, durationS: 4, onsetS: 0.05, noiseDb: -84, seed: 5 }), partials }
}

function speed() {
  const sampleRate = 48000
  const { signal } = richStrike(sampleRate)
  const result = analyzeSamples(signal, sampleRate, {})
  const fft: FftPartial[] = result.partials.map(({ crossCheckCents: _c, uncertaintyCents: _u, uncertaintyDecayPct: _d, ...p }) => p)
  const startIndex = Math.round(result.analysisStartS * sampleRate)
  const runs = quick ? 5 : 15
  const annotate: number[] = []
  const annotateCpu: number[] = []
  const whole: number[] = []
  const wholeCpu: number[] = []
  const cpuMs = (u: NodeJS.CpuUsage) => (u.user + u.system) / 1000
  for (let i = 0; i < runs + 2; i++) {
    let t = performance.now()
    let cpu = process.cpuUsage()
    annotatePartials(signal, sampleRate, fft, { startIndex, endIndex: signal.length })
    const a = performance.now() - t
    const ac = cpuMs(process.cpuUsage(cpu))
    t = performance.now()
    cpu = process.cpuUsage()
    analyzeSamples(signal, sampleRate, {})
    const w = performance.now() - t
    const wc = cpuMs(process.cpuUsage(cpu))
    if (i >= 2) {
      annotate.push(a)
      annotateCpu.push(ac)
      whole.push(w)
      wholeCpu.push(wc)
    }
  }
  // A calibration loop: 10⁷ multiply-adds, to compare figures across loads and machines.
  const x = new Float64Array(1e4).map((_, i) => Math.sin(i))
  const t = performance.now()
  let s = 0
  for (let r = 0; r < 1000; r++) for (let i = 0; i < 1e4; i++) s += x[i]! * x[(i * 7) % 1e4]!
  const calibration = performance.now() - t
  console.log(`Cross-check step, 4 s 48 kHz strike, ${fft.length} partials (${runs} runs, one thread):`)
  console.log(`  annotatePartials median ${median(annotate).toFixed(1)} ms (${(median(annotate) / fft.length).toFixed(2)} ms per partial), min ${Math.min(...annotate).toFixed(1)} ms, CPU median ${median(annotateCpu).toFixed(1)} ms`)
  console.log(`  whole engine (analyzeSamples, includes the step) median ${median(whole).toFixed(1)} ms, min ${Math.min(...whole).toFixed(1)} ms, CPU median ${median(wholeCpu).toFixed(1)} ms`)
  console.log(`  calibration: 10⁷ multiply-adds took ${calibration.toFixed(1)} ms (checksum ${s.toFixed(0)}); load average ${os.loadavg().map(v => v.toFixed(1)).join(' ')} on ${os.cpus().length} cores`)
}

function crbTable() {
  const sampleRate = 44100
  const trials = quick ? 20 : 60
  console.log(`\nCramér–Rao table: one damped sinusoid (440.3 Hz) in white noise, ${trials} seeded trials each;`)
  console.log('SNR = A²/(2σ²) per sample at the start; span until the partial is 10 dB under the noise.')
  console.log('  SNR dB  dur s  decay dB/s | RMS f Hz    CRB f Hz    ratio | RMS decay   CRB decay   ratio')
  for (const snrDb of [20, 30, 40]) {
    for (const [durationS, decayDbPerS] of [[2, 5], [0.5, 20], [0.3, 200], [0.1, 600]] as const) {
      const amplitude = 0.5
      const sigma = amplitude / Math.sqrt(2 * 10 ** (snrDb / 10))
      const n = Math.round(durationS * sampleRate)
      const end = Math.min(n, Math.round(((snrDb + 10) / decayDbPerS) * sampleRate))
      let sumF = 0
      let sumD = 0
      for (let trial = 0; trial < trials; trial++) {
        const signal = synthStrike([{ frequencyHz: 440.3, amplitudeDb: 20 * Math.log10(amplitude), decayDbPerS }], { sampleRate, durationS, noiseDb: 20 * Math.log10(sigma), seed: 500 + trial })
        const halfWidthHz = Math.max(5, 3 * decayDbPerS / DB_PER_NEPER / (2 * Math.PI))
        const band = estimateBand(signal, sampleRate, 441, { startIndex: 0, endIndex: end, halfWidthHz })!
        const c = band.components.reduce((a, b) => (b.amplitude > a.amplitude ? b : a))
        sumF += (c.frequencyHz - 440.3) ** 2
        sumD += (c.decayDbPerS - decayDbPerS) ** 2
      }
      const bound = dampedSinusoidCrb(amplitude, sigma, decayDbPerS / DB_PER_NEPER / sampleRate, n)
      const crbF = (bound.frequencySdRad * sampleRate) / (2 * Math.PI)
      const crbD = bound.dampingSdNepers * sampleRate * DB_PER_NEPER
      const rmsF = Math.sqrt(sumF / trials)
      const rmsD = Math.sqrt(sumD / trials)
      console.log(`  ${String(snrDb).padStart(6)}  ${durationS.toFixed(1).padStart(5)}  ${String(decayDbPerS).padStart(10)} | ${rmsF.toExponential(2).padStart(9)}  ${crbF.toExponential(2).padStart(9)}  ${(rmsF / crbF).toFixed(2).padStart(6)} | ${rmsD.toExponential(2).padStart(9)}  ${crbD.toExponential(2).padStart(9)}  ${(rmsD / crbD).toFixed(2).padStart(6)}`)
    }
  }
}

function pairs() {
  const sampleRate = 44100
  const seeds = quick ? 5 : 20
  const cases: { name: string, parts: SynthPartial[], durationS: number, noiseDb: number }[] = [
    { name: '1 Hz apart, 2 s, 30 dB', parts: [{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 3 }, { frequencyHz: 441, amplitudeDb: -9, decayDbPerS: 6 }], durationS: 2, noiseDb: -39 },
    { name: 'bell 0.8 Hz apart, 3 s', parts: [{ frequencyHz: 880, amplitudeDb: -10, decayDbPerS: 3 }, { frequencyHz: 880.8, amplitudeDb: -12, decayDbPerS: 4 }], durationS: 3, noiseDb: -75 },
    { name: 'steel note 2.5 Hz apart, 1.2 s', parts: [{ frequencyHz: 587.3, amplitudeDb: -8, decayDbPerS: 8 }, { frequencyHz: 589.8, amplitudeDb: -11, decayDbPerS: 12 }], durationS: 1.2, noiseDb: -75 },
    { name: 'twisting mode +6 Hz, −20 dB, 1 s', parts: [{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 10 }, { frequencyHz: 446, amplitudeDb: -26, decayDbPerS: 40 }], durationS: 1, noiseDb: -75 },
  ]
  console.log(`\nClose pairs (separateDoublet), ${seeds} seeds each: RMS errors of each partial`)
  for (const c of cases) {
    const err = [[0, 0, 0], [0, 0, 0]]
    let failed = 0
    const times: number[] = []
    for (let seed = 1; seed <= seeds; seed++) {
      const signal = synthStrike(c.parts, { sampleRate, durationS: c.durationS, noiseDb: c.noiseDb, seed })
      const centre = (c.parts[0]!.frequencyHz + c.parts[1]!.frequencyHz) / 2
      const t = performance.now()
      const pair = separateDoublet(signal, sampleRate, centre, { startIndex: 0, endIndex: signal.length, halfWidthHz: Math.max(3, c.parts[1]!.frequencyHz - c.parts[0]!.frequencyHz + 2) })
      times.push(performance.now() - t)
      if (!pair) {
        failed++
        continue
      }
      c.parts.forEach((truth, k) => {
        err[k]![0]! += (pair[k]!.frequencyHz - truth.frequencyHz) ** 2
        err[k]![1]! += (pair[k]!.decayDbPerS - truth.decayDbPerS) ** 2
        err[k]![2]! += (20 * Math.log10(pair[k]!.amplitude) - truth.amplitudeDb) ** 2
      })
    }
    const ok = seeds - failed
    const row = err.map(e => `f ${Math.sqrt(e[0]! / ok).toExponential(1)} Hz, decay ${Math.sqrt(e[1]! / ok).toExponential(1)} dB/s, level ${Math.sqrt(e[2]! / ok).toExponential(1)} dB`)
    console.log(`  ${c.name}: separated ${ok}/${seeds}; median ${median(times).toFixed(1)} ms\n    lower: ${row[0]}\n    upper: ${row[1]}`)
  }
}

const only = process.argv.find(a => a.startsWith('--only='))?.slice(7)
if (!only || only === 'speed') speed()
if (!only || only === 'crb') crbTable()
if (!only || only === 'pairs') pairs()
