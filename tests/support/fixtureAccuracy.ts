// Found/missed and agreement of the engine over the fixtures (recordings and realistic
// synthesis), with and without a target: shared by the accuracy tests and the benchmark.
import { readFileSync } from 'node:fs'
import { analyzeSamples, analyzeStrike, type AnalysisResult } from '../../shared/analysis/index'
import { quantile, scorePartials, type Score } from './accuracy'
import { REALISTIC_CASES, renderRealisticCase, tunedTruth } from './realisticStrikes'
import { realFixturePath, realFixtures } from './realFixtures'

export interface FixtureRun {
  id: string
  family: string
  kind: 'recording' | 'synthesis'
  referenceHz: number[]
  withoutTarget: AnalysisResult
  withTarget: AnalysisResult
  scoreWithout: Score
  scoreWith: Score
  /** The file's own peak level, dB re full scale. */
  peakDb: number
}

/** A recording's partial is found within 15 ¢ of the manual reading; a synthetic one within 5 ¢ of the truth. */
export const FOUND_WITHIN_CENTS = { recording: 15, synthesis: 5 } as const

function peakDbOf(samples: ArrayLike<number>): number {
  let peak = 0
  for (let i = 0; i < samples.length; i++) peak = Math.max(peak, Math.abs(samples[i]!))
  return 20 * Math.log10(peak)
}

export async function runRecordings(): Promise<FixtureRun[]> {
  const runs: FixtureRun[] = []
  for (const fixture of realFixtures()) {
    const bytes = new Uint8Array(readFileSync(realFixturePath(fixture)))
    const withoutTarget = await analyzeStrike(bytes, {})
    const withTarget = await analyzeStrike(bytes, { targetHz: fixture.targetHz, ratios: fixture.ratios })
    const referenceHz = fixture.reference.map(r => r.frequencyHz)
    // 16-bit PCM after the 44-byte header (the cache holds plain WAV files made by sox and timidity).
    const view = new DataView(bytes.buffer, bytes.byteOffset + 44, bytes.byteLength - 44)
    const samples = new Float64Array(view.byteLength >> 1)
    for (let i = 0; i < samples.length; i++) samples[i] = view.getInt16(2 * i, true) / 32768
    runs.push({
      id: fixture.id,
      family: fixture.family,
      kind: 'recording',
      referenceHz,
      withoutTarget,
      withTarget,
      scoreWithout: scorePartials(withoutTarget.partials, referenceHz, FOUND_WITHIN_CENTS.recording),
      scoreWith: scorePartials(withTarget.partials, referenceHz, FOUND_WITHIN_CENTS.recording),
      peakDb: peakDbOf(samples),
    })
  }
  return runs
}

export function runSyntheses(): FixtureRun[] {
  return REALISTIC_CASES.map((c) => {
    const x = renderRealisticCase(c)
    const referenceHz = tunedTruth(c.partials).map(p => p.frequencyHz)
    const withoutTarget = analyzeSamples(x, c.options.sampleRate)
    const withTarget = analyzeSamples(x, c.options.sampleRate, { targetHz: c.targetHz, ratios: c.ratios })
    return {
      id: c.id,
      family: c.family,
      kind: 'synthesis' as const,
      referenceHz,
      withoutTarget,
      withTarget,
      scoreWithout: scorePartials(withoutTarget.partials, referenceHz, FOUND_WITHIN_CENTS.synthesis),
      scoreWith: scorePartials(withTarget.partials, referenceHz, FOUND_WITHIN_CENTS.synthesis),
      peakDb: peakDbOf(x),
    }
  })
}

export interface FamilyRow {
  family: string
  kind: FixtureRun['kind']
  strikes: number
  partials: number
  foundWithout: number
  foundWith: number
}

export function familyTable(runs: readonly FixtureRun[]): FamilyRow[] {
  const rows = new Map<string, FamilyRow>()
  for (const r of runs) {
    const key = `${r.kind}:${r.family}`
    const row = rows.get(key) ?? { family: r.family, kind: r.kind, strikes: 0, partials: 0, foundWithout: 0, foundWith: 0 }
    row.strikes++
    row.partials += r.referenceHz.length
    row.foundWithout += r.scoreWithout.found.filter(Boolean).length
    row.foundWith += r.scoreWith.found.filter(Boolean).length
    rows.set(key, row)
  }
  return [...rows.values()]
}

/** p50 and p90 of |cents| between found partials and the reference, with a target. */
export function agreement(runs: readonly FixtureRun[]): { p50: number, p90: number, count: number } {
  const cents = runs.flatMap(r => r.scoreWith.cents).filter(Number.isFinite)
  return { p50: quantile(cents, 0.5), p90: quantile(cents, 0.9), count: cents.length }
}

export function printAccuracy(runs: readonly FixtureRun[], log: (line: string) => void = console.log): void {
  log(`  ${'family'.padEnd(14)} ${'source'.padEnd(10)} ${'strikes'.padStart(7)} ${'partials'.padStart(8)} ${'found, no target'.padStart(17)} ${'found, target'.padStart(14)}`)
  for (const row of familyTable(runs)) {
    const pct = (n: number) => `${n}/${row.partials} (${Math.round((100 * n) / row.partials)} %)`
    log(`  ${row.family.padEnd(14)} ${row.kind.padEnd(10)} ${String(row.strikes).padStart(7)} ${String(row.partials).padStart(8)} ${pct(row.foundWithout).padStart(17)} ${pct(row.foundWith).padStart(14)}`)
  }
  for (const kind of ['recording', 'synthesis'] as const) {
    const a = agreement(runs.filter(r => r.kind === kind))
    if (a.count > 0) log(`  ${kind === 'recording' ? 'recordings' : 'syntheses'}: frequency agreement with the ${kind === 'recording' ? 'manual reading' : 'truth'} over ${a.count} partials: p50 ${a.p50.toFixed(3)} ¢, p90 ${a.p90.toFixed(3)} ¢`)
  }
  const misses = runs.flatMap(r => r.referenceHz
    .map((f, i) => ({ f, without: r.scoreWithout.found[i], with: r.scoreWith.found[i] }))
    .filter(m => !m.without || !m.with)
    .map(m => `${r.id} ${m.f.toFixed(2)} Hz (${m.without ? '' : 'missed without target'}${!m.without && !m.with ? ', ' : ''}${m.with ? '' : 'missed with target'})`))
  if (misses.length > 0) log(`  still missed: ${misses.join('; ')}`)
}
