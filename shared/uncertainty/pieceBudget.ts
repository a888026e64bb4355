import { decideConformity } from './decideConformity'
import type { ClockEvidence, NotAssessed, PartialBudgetResult, PieceBudget } from './evidence'
import { ASSUMED_TEMPERATURE_HALF_WIDTH_K, STORED_RESOLUTION_CENTS } from './evidence'
import { partialBudget } from './partialBudget'
import { pieceVerdict } from './pieceVerdict'
import type { DecisionRule } from './types'

/** A tuned partial of the reference strike as the budget reads it. */
export interface BudgetMatch {
  label: string
  cents: number | null
  toleranceCents: number
  required: boolean
  missing: boolean
  /** The engine's one-standard-deviation uncertainty of this partial, ¢ (null: the engine gave none). */
  uncertaintyCents: number | null
}

export interface PieceBudgetInput {
  /** The reference strike's partials: the approved strike, else the latest. */
  matches: readonly BudgetMatch[]
  /** Each final-state strike's deviations by partial label (the reference strike among them). */
  finalState: readonly { label: string, cents: number | null }[][]
  clock: ClockEvidence
  temperatureRecorded: boolean
  temperatureCoefficientCentsPerK: number
  rule: DecisionRule
}

function readingsOf(finalState: PieceBudgetInput['finalState'], label: string): number[] {
  const out: number[] = []
  for (const strike of finalState) {
    const c = strike.find(m => m.label === label)?.cents
    if (typeof c === 'number' && Number.isFinite(c)) out.push(c)
  }
  return out
}

function gaps(readings: number, m: BudgetMatch, clock: ClockEvidence, temperatureRecorded: boolean): NotAssessed[] {
  const out: NotAssessed[] = []
  if (readings < 2) out.push({ name: 'repeatability', reason: `only ${readings} reading${readings === 1 ? '' : 's'} at the final state; two or more are needed` })
  if (m.uncertaintyCents === null) out.push({ name: 'estimator', reason: 'the engine that measured this strike gave no per-partial uncertainty' })
  if (clock.state === 'none') out.push({ name: 'clock calibration', reason: 'the strike was not measured under an input calibration' })
  else if (clock.driftPpm === null) out.push({ name: 'clock drift since calibration', reason: `${clock.device} has only one calibration before the strike, so no drift history` })
  if (!temperatureRecorded) out.push({ name: 'bench temperature', reason: 'no bench temperature was recorded with the strike' })
  return out
}

/**
 * The uncertainty budget of each partial of a piece's reference strike (JCGM 100:2008 §5,
 * k = 2) and its verdict under simple and guarded acceptance (ILAC-G8:09/2019 §4.2).
 * Components without evidence are listed as not assessed, never guessed.
 */
export function pieceBudget(input: PieceBudgetInput): PieceBudget {
  const { clock, temperatureRecorded } = input
  const partials: PartialBudgetResult[] = input.matches.map((m) => {
    const readings = readingsOf(input.finalState, m.label)
    const notAssessed = gaps(readings.length, m, clock, temperatureRecorded)
    if (m.missing || m.cents === null) {
      return { label: m.label, required: m.required, deviationCents: null, toleranceCents: m.toleranceCents, budget: null, notAssessed, readingCount: readings.length, simple: null, guarded: null }
    }
    const budget = partialBudget({
      readingsCents: readings,
      estimatorUncertaintyCents: m.uncertaintyCents,
      clockUncertaintyPpm: clock.state === 'calibrated' ? clock.uncertaintyPpm : null,
      clockDriftPpm: clock.state === 'calibrated' ? clock.driftPpm : null,
      temperatureUncertaintyK: temperatureRecorded ? ASSUMED_TEMPERATURE_HALF_WIDTH_K : null,
      temperatureCoefficientCentsPerK: input.temperatureCoefficientCentsPerK,
      resolutionCents: STORED_RESOLUTION_CENTS,
    })
    const U = budget.expandedUncertainty
    return {
      label: m.label, required: m.required, deviationCents: m.cents, toleranceCents: m.toleranceCents, budget, notAssessed, readingCount: readings.length,
      simple: decideConformity(m.cents, m.toleranceCents, U, 'simple'),
      guarded: decideConformity(m.cents, m.toleranceCents, U, 'guarded'),
    }
  })
  const required = partials.filter(p => p.required)
  const simple = pieceVerdict(required.map(p => p.simple))
  const guarded = pieceVerdict(required.map(p => p.guarded))
  const [verdict, other] = input.rule === 'simple' ? [simple, guarded] : [guarded, simple]
  return {
    rule: input.rule, strikeCount: input.finalState.length, clock, temperatureRecorded, partials,
    verdict, verdictUnderOtherRule: other, dependsOnRule: simple !== guarded,
  }
}
