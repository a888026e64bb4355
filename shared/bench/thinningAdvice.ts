import { thinningMap } from './freeFreeBeam'

/** A matched partial as the Bench sees it (the engine's `matches[]`). */
export interface AdviceMatch {
  label: string
  cents: number | null
  toleranceCents: number
  within: boolean
  missing: boolean
  required?: boolean
}

export interface PartialAdvice {
  label: string
  /** Signed deviation in cents (positive: sharp). */
  cents: number
  /** How far and which way the partial must move to reach its target, in cents. */
  moveCents: number
  move: 'lower' | 'raise'
  /** Bending mode of the free–free bar this partial is tuned on (1 = fundamental), or null for other families. */
  mode: number | null
  /** Where to thin, as fractions of the length from each end (0…0.5), for bars only. */
  thinAt: { from: number, to: number }[]
  /** A plain sentence for the benchmaker. */
  sentence: string
}

/** Families whose pieces bend like a free–free bar (plates are treated as wide bars). */
export const BAR_FAMILIES = ['bar', 'plate'] as const

const percent = (u: number) => `${Math.round(u * 100)} %`

/**
 * Which way each partial outside tolerance must move, and, for bars and plates, where
 * thinning moves it, from the first-order Rayleigh-quotient perturbation of a uniform
 * free–free beam (see freeFreeBeam.ts). The n-th template partial of a bar is taken as
 * its n-th bending mode, as tuned bars are made. A starting point only: an undercut
 * arch, a real bar's grain and the benchmaker's ear decide.
 */
export function thinningAdvice(matches: readonly AdviceMatch[], family: string | null | undefined): PartialAdvice[] {
  const isBar = (BAR_FAMILIES as readonly string[]).includes(family ?? '')
  const out: PartialAdvice[] = []
  matches.forEach((m, index) => {
    if (m.missing || m.within || m.cents === null) return
    const move = m.cents > 0 ? 'lower' : 'raise'
    const moveCents = Math.abs(m.cents)
    const mode = isBar && index < 4 ? index + 1 : null
    let thinAt: PartialAdvice['thinAt'] = []
    let where = ''
    if (mode !== null) {
      const map = thinningMap(mode)
      if (move === 'lower') {
        const at = map.lowersMostAt[0]!
        thinAt = at >= 0.49 ? [{ from: 0.4, to: 0.5 }] : [{ from: Math.max(0, at - 0.05), to: at + 0.05 }]
        where = at >= 0.49
          ? 'thin near the centre of the bar'
          : `thin at about ${at.toFixed(2)} of the length from each end (${percent(at)} in)`
        if (Math.abs(map.atCentre) < 0.01) where += '; thinning at the centre leaves it unchanged'
      }
      else {
        thinAt = map.raisesWithin.filter(([a]) => a < 0.01).map(([a, b]) => ({ from: a, to: b }))
        const reach = thinAt[0]?.to ?? 0
        where = `thin within the outer ${percent(reach)} of the length at each end`
      }
    }
    const sentence = `${capitalise(move)} the ${m.label} by ${moveCents.toFixed(1)} ¢${where ? `: ${where}` : ''}.`
    out.push({ label: m.label, cents: m.cents, moveCents, move, mode, thinAt, sentence })
  })
  return out
}

function capitalise(text: string) {
  return text.charAt(0).toUpperCase() + text.slice(1)
}
