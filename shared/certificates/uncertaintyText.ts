/**
 * The certificate's measurement-uncertainty paragraph, computed from the per-partial
 * standard uncertainties the engine stored with the strikes the certificate rests on.
 * Strikes measured before the engine estimated an uncertainty carry none; the
 * paragraph says so instead of claiming a figure.
 */

/** The coverage factor for the expanded uncertainty U = k · u. source: JCGM 100:2008 (GUM) §6.2.1, §6.3.3 (k = 2, about 95 % for a normal distribution) */
export const COVERAGE_FACTOR = 2

/** A measured partial as stored in a strike's analysis; the uncertainty exists from engine 2 on. */
export interface StoredPartial {
  frequencyHz: number
  uncertaintyCents?: number | null
}

/** A template partial matched on the strike, as stored; engines may also copy the uncertainty here. */
export interface StoredMatch {
  measuredHz: number | null
  required: boolean
  missing: boolean
  uncertaintyCents?: number | null
}

export interface UncertaintyStrike {
  engineVersion: string
  matches: StoredMatch[]
  partials: StoredPartial[]
}

export interface UncertaintyFigures {
  strikeCount: number
  /** Tuned (required, found) partials over all strikes. */
  tunedPartials: number
  /** Of those, how many carry a standard uncertainty. */
  withUncertainty: number
  /** Strikes none of whose tuned partials carries an uncertainty, and their engine versions. */
  strikesWithout: number
  enginesWithout: string[]
  /** Expanded (k = 2) uncertainty in cents: the largest and the median over the tuned partials that carry one. */
  largestCents: number | null
  medianCents: number | null
}

const usable = (u: unknown): u is number => typeof u === 'number' && Number.isFinite(u) && u >= 0

/** The standard uncertainty of a matched partial: on the match itself, else on the measured partial at the same frequency. */
export function matchUncertaintyCents(match: StoredMatch, partials: StoredPartial[]): number | null {
  if (usable(match.uncertaintyCents)) return match.uncertaintyCents
  if (match.measuredHz === null) return null
  let best: StoredPartial | null = null
  for (const p of partials) {
    if (!best || Math.abs(p.frequencyHz - match.measuredHz) < Math.abs(best.frequencyHz - match.measuredHz)) best = p
  }
  // The match copies the partial's frequency, so the same partial sits within rounding of it.
  if (!best || Math.abs(best.frequencyHz - match.measuredHz) > 1e-6 * match.measuredHz + 1e-3) return null
  return usable(best.uncertaintyCents) ? best.uncertaintyCents : null
}

function median(sorted: number[]): number {
  const mid = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2
}

export function uncertaintyFigures(strikes: UncertaintyStrike[]): UncertaintyFigures {
  const expanded: number[] = []
  let tunedPartials = 0
  let strikesWithout = 0
  const enginesWithout = new Set<string>()
  for (const strike of strikes) {
    const tuned = strike.matches.filter(m => m.required && !m.missing && m.measuredHz !== null)
    tunedPartials += tuned.length
    const found = tuned.map(m => matchUncertaintyCents(m, strike.partials)).filter(usable)
    if (tuned.length && !found.length) {
      strikesWithout++
      enginesWithout.add(strike.engineVersion)
    }
    expanded.push(...found.map(u => COVERAGE_FACTOR * u))
  }
  expanded.sort((a, b) => a - b)
  return {
    strikeCount: strikes.length, tunedPartials, withUncertainty: expanded.length, strikesWithout,
    enginesWithout: [...enginesWithout].sort(),
    largestCents: expanded.length ? expanded[expanded.length - 1]! : null,
    medianCents: expanded.length ? median(expanded) : null,
  }
}

/**
 * Two significant figures, rounded up so the stated figure never understates the doubt.
 * source: JCGM 100:2008 (GUM) §7.2.6 (at most two significant digits; rounding up may be appropriate)
 */
export function roundUpCents(cents: number): string {
  if (cents <= 0) return '0'
  const exponent = Math.floor(Math.log10(cents)) - 1
  const scale = 10 ** exponent
  // The small allowance keeps binary noise (0.30000000000000004) from rounding a whole step up.
  const value = Math.ceil(cents / scale - 1e-9) * scale
  return value.toFixed(Math.max(0, -exponent))
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`

const TEMPERATURE = 'Beyond the measurement itself, the bench temperature matters: every 1 °C of error in the recorded temperature moves a normalised deviation by the template\'s temperature coefficient.'
const NOT_APPLIED = 'As the decision rule says, these figures are not added to or taken from the tolerances.'

/** The paragraph, in plain words for the buyer. */
export function uncertaintyText(strikes: UncertaintyStrike[]): string {
  const f = uncertaintyFigures(strikes)
  const basis = `This certificate rests on ${plural(f.strikeCount, 'strike', 'strikes')}, one for each piece.`
  if (f.tunedPartials === 0) {
    return `${basis} No tuned partial was measured, so no measurement uncertainty can be stated. ${TEMPERATURE}`
  }
  if (f.withUncertainty === 0) {
    return `${basis} They were measured with an earlier version of the measurement engine (${f.enginesWithout.join(', ')}) that did not yet estimate the uncertainty of each partial, so no measured uncertainty is stated here; the deviations are given as measured. ${TEMPERATURE}`
  }
  const largest = roundUpCents(f.largestCents!)
  const typical = roundUpCents(f.medianCents!)
  const parts = [
    basis,
    'For each tuned partial the engine estimates how far its measured frequency may be off, from how strongly the partial stands above the background noise, how long it sounds and how fast it dies away, from how well two independent ways of measuring it agree, and with an allowance for other sound close to its pitch, such as the room\'s echo of it.',
    `Over the ${plural(f.withUncertainty, 'tuned partial', 'tuned partials')} with such an estimate, the measured frequency is within ±${typical} ¢ for a typical partial and within ±${largest} ¢ for the least certain one, each with about 95 % confidence (expanded uncertainty, coverage factor k = 2).`,
  ]
  const without = f.tunedPartials - f.withUncertainty
  if (without > 0) {
    const engines = f.enginesWithout.length ? ` (measured with engine ${f.enginesWithout.join(', ')})` : ''
    parts.push(`For the other ${plural(without, 'tuned partial', 'tuned partials')}${engines} no estimate is available.`)
  }
  parts.push(NOT_APPLIED, TEMPERATURE)
  return parts.join(' ')
}
