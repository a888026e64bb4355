// Benchmark of the measurement engine (npm run bench:analysis).
// Prints, for this machine: the median decode + analysis time of a 4 s, 48 kHz mono
// strike with three decaying partials (≥ 20 runs) and of 4 s of a real strike with 30+
// partials (a freepats tubular bell rendered by timidity), the peak extra memory, the
// error table over the synthetic set and the found/missed table per family over the
// fixtures. Figures only — the accuracy goals are asserted by the unit tests, not here.
import { readFileSync } from 'node:fs'
import os from 'node:os'
import v8 from 'node:v8'
import vm from 'node:vm'
import { analyzeSamples, analyzeStrike, centsBetween, decodeAudio, encodeWav, ENGINE_VERSION } from '../shared/analysis/index'
import type { MeasuredPartial } from '../shared/analysis/index'
import { synthStrike, type SynthPartial } from '../shared/synthesis/synthStrike'
import { printAccuracy, runRecordings, runSyntheses } from '../tests/support/fixtureAccuracy'
import { realFixturePath, realFixtures } from '../tests/support/realFixtures'

const RUNS = 30

// A handle on the garbage collector, so one run's own allocations can be measured.
v8.setFlagsFromString('--expose-gc')
const gc = vm.runInNewContext('gc') as () => void
const heapNow = () => {
  const m = process.memoryUsage()
  return m.heapUsed + m.arrayBuffers
}
const sampleRate = 48000

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s.length % 2 ? s[s.length >> 1]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2
}

async function timing() {
  const partials: SynthPartial[] = [
    { frequencyHz: 261.63, amplitudeDb: -6, decayDbPerS: 15 },
    { frequencyHz: 1046.5, amplitudeDb: -18, decayDbPerS: 30 },
    { frequencyHz: 2616.3, amplitudeDb: -26, decayDbPerS: 45 },
  ]
  const bytes = encodeWav(synthStrike(partials, { sampleRate, durationS: 4, onsetS: 0.05, noiseDb: -72, seed: 1 }), sampleRate)
  const cases = [
    { name: 'with target (C4, ratios 1,4,10)', options: { note: 'C4', ratios: [1, 4, 10], tolerances: [2, 5, 8] } },
    { name: 'no target (rough pass first)', options: {} },
  ]
  const rssBefore = process.memoryUsage().rss
  const maxRssBeforeKb = process.resourceUsage().maxRSS
  const rows: string[] = []
  for (const c of cases) {
    for (let i = 0; i < 3; i++) await analyzeStrike(bytes, c.options) // warm-up (JIT, decoder)
    const times: number[] = []
    const cpuTimes: number[] = []
    for (let i = 0; i < RUNS; i++) {
      const t = performance.now()
      const cpu = process.cpuUsage()
      await analyzeStrike(bytes, c.options)
      const used = process.cpuUsage(cpu)
      times.push(performance.now() - t)
      cpuTimes.push((used.user + used.system) / 1000)
    }
    rows.push(
      `  ${c.name.padEnd(34)} median ${median(times).toFixed(1).padStart(6)} ms   min ${Math.min(...times).toFixed(1).padStart(6)} ms   max ${Math.max(...times).toFixed(1).padStart(6)} ms   `
      + `CPU median ${median(cpuTimes).toFixed(1).padStart(6)} ms   CPU min ${Math.min(...cpuTimes).toFixed(1).padStart(6)} ms   (${RUNS} runs)`,
    )
  }
  const peakExtraMb = (process.resourceUsage().maxRSS * 1024 - Math.max(rssBefore, maxRssBeforeKb * 1024)) / 2 ** 20
  // One run between two collections: what it allocates is an upper bound of its peak.
  const perRun: number[] = []
  for (let i = 0; i < 5; i++) {
    gc()
    const before = heapNow()
    await analyzeStrike(bytes, cases[0]!.options)
    perRun.push(heapNow() - before)
  }
  console.log(`Decode + analysis of a 4 s, ${sampleRate} Hz, 16-bit mono WAV (${(bytes.length / 1024).toFixed(0)} KB), goal ≤ 60 ms median:`)
  for (const r of rows) console.log(r)
  console.log(`  (wall-clock times; CPU time is the process's own, including the collector — it tells a busy machine from slow code; load average ${os.loadavg()[0]!.toFixed(1)})`)
  console.log(`  peak extra memory of one run (heap + array buffers allocated, no collection): ${(median(perRun) / 2 ** 20).toFixed(1)} MB`)
  console.log(`  process high-water mark over all runs (max RSS − RSS before, includes uncollected garbage): ${Math.max(0, peakExtraMb).toFixed(1)} MB`)
}

function nearest(partials: MeasuredPartial[], frequencyHz: number): MeasuredPartial | undefined {
  let best: MeasuredPartial | undefined
  for (const p of partials) if (!best || Math.abs(p.frequencyHz - frequencyHz) < Math.abs(best.frequencyHz - frequencyHz)) best = p
  return best
}

function errorTable() {
  type Row = { set: string, count: number, freqCents: number, ampDb: number, decayPct: number, extra: number }
  const rows: Row[] = []
  const measure = (set: string, frequencies: number[], rates: number[], snrDb: number, overS: number) => {
    const row: Row = { set, count: 0, freqCents: 0, ampDb: 0, decayPct: 0, extra: 0 }
    let seed = 500
    for (const rate of rates) {
      frequencies.forEach((frequencyHz, i) => {
        const truth = { frequencyHz, amplitudeDb: -12, decayDbPerS: 6 + 2 * i, phaseRad: 0.9 * i }
        const noiseDb = truth.amplitudeDb - 3.0103 - truth.decayDbPerS * overS - snrDb
        const x = synthStrike([truth], { sampleRate: rate, durationS: overS + 0.7, onsetS: 0.05, noiseDb, seed: seed++ })
        const result = analyzeSamples(x, rate)
        const p = nearest(result.partials, frequencyHz)
        row.count++
        row.extra += Math.max(0, result.partials.length - 1)
        if (!p) {
          row.freqCents = Infinity
          return
        }
        row.freqCents = Math.max(row.freqCents, Math.abs(centsBetween(p.frequencyHz, frequencyHz)))
        row.ampDb = Math.max(row.ampDb, Math.abs(p.amplitudeDb - truth.amplitudeDb))
        row.decayPct = Math.max(row.decayPct, 100 * Math.abs(p.decayDbPerS / truth.decayDbPerS - 1))
      })
    }
    rows.push(row)
  }
  const rates = [44100, 48000, 96000]
  measure('65.4 Hz, SNR 30 dB over 0.5 s', [65.41], rates, 30, 0.5)
  measure('100 Hz–4 kHz, SNR 30 dB over 0.5 s', [100, 261.63, 440, 1046.5, 2093, 4000], rates, 30, 0.5)
  measure('100 Hz–4 kHz, SNR 40 dB over 1 s', [100, 261.63, 440, 1046.5, 2093, 4000], rates, 40, 1)

  console.log('\nError table over the synthetic set (worst case per row; goals: ≤ 0.1 ¢ at ≥ 100 Hz, ≤ 0.3 ¢ at 65 Hz, ≤ 0.2 dB, ≤ 3 %):')
  console.log(`  ${'set'.padEnd(36)} ${'strikes'.padStart(7)} ${'freq error'.padStart(11)} ${'amp error'.padStart(10)} ${'decay error'.padStart(12)} ${'extra partials'.padStart(15)}`)
  for (const r of rows) {
    console.log(
      `  ${r.set.padEnd(36)} ${String(r.count).padStart(7)} ${`${r.freqCents.toFixed(4)} ¢`.padStart(11)} ${`${r.ampDb.toFixed(3)} dB`.padStart(10)} ${`${r.decayPct.toFixed(2)} %`.padStart(12)} ${String(r.extra).padStart(15)}`,
    )
  }

  // Two partials 3 Hz apart, 1.6 s of sound.
  const pair = synthStrike(
    [
      { frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 6 },
      { frequencyHz: 443, amplitudeDb: -14, decayDbPerS: 6 },
    ],
    { sampleRate, durationS: 1.6, onsetS: 0.05, noiseDb: -70, seed: 21 },
  )
  const pairResult = analyzeSamples(pair, sampleRate)
  const pairText = pairResult.partials.map(p => `${p.frequencyHz.toFixed(4)} Hz (beat ${p.beatHz ?? '—'} Hz)`).join(', ')
  console.log(`\n  two partials 440 Hz + 443 Hz, 1.55 s of sound: ${pairResult.partials.length} found: ${pairText}`)
  const a = nearest(pairResult.partials, 440)
  const b = nearest(pairResult.partials, 443)
  if (a && b && a !== b) {
    console.log(`    errors ${centsBetween(a.frequencyHz, 440).toFixed(4)} ¢ and ${centsBetween(b.frequencyHz, 443).toFixed(4)} ¢`)
  }

  let spurious = 0
  const noiseRuns = 20
  for (let i = 0; i < noiseRuns; i++) {
    const x = synthStrike([], { sampleRate, durationS: 2, noiseDb: -30 - 2 * i, seed: 900 + i })
    spurious += analyzeSamples(x, sampleRate).partials.length
  }
  console.log(`  noise only (${noiseRuns} recordings of 2 s, white noise −30 to −68 dBFS): ${spurious} spurious partials`)
}

async function realStrikeTiming() {
  const fixture = realFixtures().find(f => f.id === 'tubular-bells-c5')!
  const decoded = await decodeAudio(new Uint8Array(readFileSync(realFixturePath(fixture))))
  const rate = decoded.sampleRate
  const bytes = encodeWav(decoded.channelData[0]!.subarray(0, 4 * rate), rate)
  const options = { targetHz: fixture.targetHz, ratios: fixture.ratios }
  for (let i = 0; i < 3; i++) await analyzeStrike(bytes, options)
  const times: number[] = []
  const cpuTimes: number[] = []
  let partials = 0
  for (let i = 0; i < RUNS; i++) {
    const t = performance.now()
    const cpu = process.cpuUsage()
    partials = (await analyzeStrike(bytes, options)).partials.length
    const used = process.cpuUsage(cpu)
    times.push(performance.now() - t)
    cpuTimes.push((used.user + used.system) / 1000)
  }
  console.log(`\nDecode + analysis of 4 s of a real strike (${fixture.id}, ${rate} Hz, ${partials} partials), goal ≤ 120 ms median:`)
  console.log(`  median ${median(times).toFixed(1)} ms   min ${Math.min(...times).toFixed(1)} ms   CPU median ${median(cpuTimes).toFixed(1)} ms   CPU min ${Math.min(...cpuTimes).toFixed(1)} ms   (${RUNS} runs; load average ${os.loadavg()[0]!.toFixed(1)})`)
}

async function accuracyTable() {
  console.log('\nTuned partials found (the three lowest of the five strongest), per family:')
  printAccuracy([...await runRecordings(), ...runSyntheses()])
}

// npm run bench:analysis runs a precompiled bundle (scripts/run-built.mjs), as the server's analysis
// worker runs the engine; run as TypeScript source (npx tsx) it pays a loader's cost on top.
const form = import.meta.url.endsWith('.mjs') ? 'precompiled, as the analysis worker runs it' : 'TypeScript source under a loader'
console.log(`Tonewright measurement engine ${ENGINE_VERSION} (${form}) — ${os.cpus()[0]?.model ?? 'unknown CPU'}, ${os.cpus().length} cores, Node ${process.version}\n`)
await timing()
await realStrikeTiming()
errorTable()
await accuracyTable()
