// Sweep of the engine over many real strikes from the fixtures' own sources (not a test):
// freepats tuned-percussion patches rendered note by note across their range and the
// struck sounds of sonic-pi-samples, made exactly as tests/support/realFixtures.ts makes
// the fixtures, into the git-ignored cache .data/sweep/. Each is read independently
// (tests/support/referencePartials.ts: the three lowest of the five strongest) and run
// through the engine with the family's target and template and without a target.
//   npx tsx scripts/sweep-real-strikes.ts [--only FAMILY] [--cli N] [--rate HZ] [--out FILE.json]
// --rate converts each strike to that sample rate with sox (rate -v) first: a recording at
// 44.1 or 96 kHz must read as the same strike at 48 kHz does.
// Prints found/missed per family, frequency agreement, every miss and every partial
// whose amplitude or decay cannot be (above the file's peak, growing, not finite).
import { execFileSync } from 'node:child_process'
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { AnalysisError, analyzeStrike, centsBetween, type AnalysisResult, type MeasuredPartial } from '../shared/analysis/index'
import { quantile, scorePartials } from '../tests/support/accuracy'
import { realFixturePath, realFixtures } from '../tests/support/realFixtures'
import { readPcm16Wav, referencePartials } from '../tests/support/referencePartials'
import { SWEEP_CASES, type SweepCase } from './sweep-real-strikes-cases'

const ROOT = fileURLToPath(new URL('../', import.meta.url))
const CACHE = join(ROOT, '.data', 'sweep')
const FOUND_CENTS = 15 // as the fixtures' tests: tests/fixtures/real/README.md

const args = process.argv.slice(2)
const flag = (name: string) => (args.includes(name) ? args[args.indexOf(name) + 1] : undefined)
const only = flag('--only')
const cliCount = Number(flag('--cli') ?? 0)
const outPath = flag('--out')
const rate = flag('--rate')

interface SweepRun {
  id: string
  family: string
  file: string
  targetHz: number
  ratios: number[]
  referenceHz: number[]
  referenceDb: number[]
  peakDb: number
  durationS: number
  foundWith: boolean[]
  foundWithout: boolean[]
  centsWith: number[]
  withTarget: AnalysisResult
  withoutTarget: AnalysisResult
}

const noteHz = (midi: number) => 440 * 2 ** ((midi - 69) / 12)

function targetFor(c: SweepCase, referenceHz: number[]): number {
  if (c.source.kind === 'freepats') return Number(noteHz(c.source.note).toFixed(2))
  // A sample has no note: the workshop would give the equal-tempered note nearest the lowest reading.
  const lowest = referenceHz[0] ?? 440
  return Number(noteHz(Math.round(69 + 12 * Math.log2(lowest / 440))).toFixed(2))
}

/** Readings no strike can give: above the file's peak, growing, a T60 under 5 ms, or not finite. */
function impossible(p: MeasuredPartial, peakDb: number, sampleRate: number): string | undefined {
  const values = [p.frequencyHz, p.amplitudeDb, p.decayDbPerS]
  if (!values.every(Number.isFinite)) return 'not finite'
  if (p.amplitudeDb > peakDb + 1) return `amplitude ${p.amplitudeDb.toFixed(1)} dB over the file's peak ${peakDb.toFixed(1)} dB`
  if (p.decayDbPerS < -0.5) return `growing ${(-p.decayDbPerS).toFixed(1)} dB/s`
  if (p.decayDbPerS > 12000) return `decay ${p.decayDbPerS.toFixed(0)} dB/s (T60 under 5 ms)`
  if (p.frequencyHz <= 0 || p.frequencyHz >= sampleRate / 2) return 'frequency outside the file'
  return undefined
}

async function runCase(c: SweepCase): Promise<SweepRun> {
  const made = realFixturePath(c, CACHE)
  const file = rate ? made.replace(/\.wav$/, `.${rate}.wav`) : made
  if (rate && !existsSync(file)) execFileSync('sox', [made, file, 'rate', '-v', rate])
  const bytes = new Uint8Array(readFileSync(file))
  const { samples, sampleRate } = readPcm16Wav(bytes)
  const reading = referencePartials(samples, sampleRate)
  const referenceHz = reading.map(r => r.frequencyHz)
  const targetHz = targetFor(c, referenceHz)
  const withTarget = await analyzeStrike(bytes, { targetHz, ratios: c.ratios })
  const withoutTarget = await analyzeStrike(bytes, {})
  const scoreWith = scorePartials(withTarget.partials, referenceHz, FOUND_CENTS)
  const scoreWithout = scorePartials(withoutTarget.partials, referenceHz, FOUND_CENTS)
  let peak = 0
  for (const v of samples) peak = Math.max(peak, Math.abs(v))
  return {
    id: c.id, family: c.family, file, targetHz, ratios: c.ratios, referenceHz,
    referenceDb: reading.map(r => r.amplitudeDb), peakDb: 20 * Math.log10(peak), durationS: samples.length / sampleRate,
    foundWith: scoreWith.found, foundWithout: scoreWithout.found, centsWith: scoreWith.cents, withTarget, withoutTarget,
  }
}

function nearestText(partials: readonly MeasuredPartial[], f: number): string {
  let best: MeasuredPartial | undefined
  for (const p of partials) if (!best || Math.abs(centsBetween(p.frequencyHz, f)) < Math.abs(centsBetween(best.frequencyHz, f))) best = p
  return best ? `nearest ${best.frequencyHz.toFixed(2)} Hz (${centsBetween(best.frequencyHz, f).toFixed(0)} ¢)` : 'no partial'
}

function printTable(runs: SweepRun[]) {
  const families = [...new Set(runs.map(r => r.family))]
  console.log(`\n  ${'family'.padEnd(14)} ${'strikes'.padStart(7)} ${'partials'.padStart(8)} ${'found, no target'.padStart(17)} ${'found, target'.padStart(14)} ${'p50 ¢'.padStart(7)} ${'p90 ¢'.padStart(7)}`)
  const line = (name: string, rs: SweepRun[]) => {
    const n = rs.reduce((s, r) => s + r.referenceHz.length, 0)
    const without = rs.reduce((s, r) => s + r.foundWithout.filter(Boolean).length, 0)
    const withT = rs.reduce((s, r) => s + r.foundWith.filter(Boolean).length, 0)
    const cents = rs.flatMap(r => r.centsWith)
    const pct = (k: number) => `${k}/${n} (${Math.round((100 * k) / n)} %)`
    console.log(`  ${name.padEnd(14)} ${String(rs.length).padStart(7)} ${String(n).padStart(8)} ${pct(without).padStart(17)} ${pct(withT).padStart(14)} ${quantile(cents, 0.5).toFixed(2).padStart(7)} ${quantile(cents, 0.9).toFixed(2).padStart(7)}`)
  }
  for (const f of families) line(f, runs.filter(r => r.family === f))
  line('all', runs)
}

function printMisses(runs: SweepRun[]) {
  console.log('\nMisses (reference partial, its level in the 1 s reading, which runs missed it, the nearest reported partial with a target):')
  for (const r of runs) {
    r.referenceHz.forEach((f, i) => {
      if (r.foundWith[i] && r.foundWithout[i]) return
      const which = [!r.foundWithout[i] && 'no target', !r.foundWith[i] && 'target'].filter(Boolean).join(' + ')
      console.log(`  ${r.id.padEnd(24)} ${f.toFixed(2).padStart(9)} Hz @ ${r.referenceDb[i]!.toFixed(1)} dB  missed with ${which}; ${nearestText(r.withTarget.partials, f)}`)
    })
  }
}

function printImpossible(runs: SweepRun[]) {
  const lines: string[] = []
  for (const r of runs) {
    for (const [name, result] of [['target', r.withTarget], ['no target', r.withoutTarget]] as const) {
      for (const p of result.partials) {
        const why = impossible(p, r.peakDb, result.sampleRate)
        if (why) lines.push(`  ${r.id} (${name}) ${p.frequencyHz.toFixed(2)} Hz: ${why}`)
      }
    }
  }
  console.log(`\nPartials with an impossible amplitude or decay: ${lines.length}`)
  for (const l of lines) console.log(l)
}

/** The automatic reading beside the hand reading of the committed fixtures. */
function checkReadingRule() {
  const differ: string[] = []
  for (const f of realFixtures()) {
    const { samples, sampleRate } = readPcm16Wav(new Uint8Array(readFileSync(realFixturePath(f))))
    const auto = referencePartials(samples, sampleRate).map(r => r.frequencyHz)
    const hand = f.reference.map(r => r.frequencyHz)
    const same = auto.length === hand.length && auto.every((a, i) => Math.abs(centsBetween(a, hand[i]!)) <= 5)
    if (!same) differ.push(`${f.id}: rule ${auto.map(a => a.toFixed(2)).join(', ')} | hand ${hand.map(a => a.toFixed(2)).join(', ')}`)
  }
  console.log(`Reading rule against the hand readings of the ${realFixtures().length} fixtures: ${differ.length} differ`)
  for (const d of differ) console.log(`  ${d}`)
}

/** The CLI path (npm run analyze -- FILE --target-hz F --ratios R --json) gives the same partials. */
function checkCli(runs: SweepRun[], count: number) {
  const step = Math.max(1, Math.floor(runs.length / count))
  for (let i = 0; i < runs.length && i / step < count; i += step) {
    const r = runs[i]!
    const out = execFileSync('npm', ['run', '--silent', 'analyze', '--', r.file, '--target-hz', String(r.targetHz), '--ratios', r.ratios.join(','), '--json'], { cwd: ROOT, encoding: 'utf8' })
    const cli = JSON.parse(out) as AnalysisResult
    const score = scorePartials(cli.partials, r.referenceHz, FOUND_CENTS)
    const same = cli.partials.length === r.withTarget.partials.length
      && cli.partials.every((p, k) => Math.abs(p.frequencyHz - r.withTarget.partials[k]!.frequencyHz) < 1e-6)
    console.log(`  CLI ${r.id}: ${cli.partials.length} partials, found ${score.found.filter(Boolean).length}/${r.referenceHz.length}, ${same ? 'same as in-process' : 'DIFFERS from in-process'}`)
  }
}

const cases = SWEEP_CASES.filter(c => !only || c.family === only)
checkReadingRule()
const runs: SweepRun[] = []
const skipped: string[] = []
for (const c of cases) {
  try {
    runs.push(await runCase(c))
  }
  catch (error) {
    if (!(error instanceof AnalysisError)) throw error
    skipped.push(`${c.id} (${error.message})`)
  }
}
if (skipped.length > 0) console.log(`Left out, the engine refuses them: ${skipped.join('; ')}`)
console.log(`\nSweep over ${runs.length} strikes (found within ${FOUND_CENTS} ¢; agreement with a target):`)
printTable(runs)
printMisses(runs)
printImpossible(runs)
if (cliCount > 0) {
  console.log('\nCLI path:')
  checkCli(runs, cliCount)
}
if (outPath) writeFileSync(outPath, JSON.stringify(runs.map(({ withTarget, withoutTarget, ...r }) => ({ ...r, target: withTarget.partials, none: withoutTarget.partials })), null, 1))
