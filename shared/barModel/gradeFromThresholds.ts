import type { BarMaterial } from '../records/barMaterials'
import { BLANK_THRESHOLDS, type BlankThreshold } from './blankThresholds'

export const BLANK_RANKS = ['select', 'usable', 'reject'] as const
export type BlankRank = (typeof BLANK_RANKS)[number]

/** Whose figures a blank was judged against: the workshop's own, or the starting ones. */
export const THRESHOLD_SOURCES = { workshop: 'your thresholds', starting: 'starting thresholds' } as const
export type ThresholdSource = keyof typeof THRESHOLD_SOURCES

export interface BlankGrade {
  species: BarMaterial
  rank: BlankRank
  /** One plain sentence per figure that kept the blank from a better rank. */
  reasons: string[]
  /** The limits it was judged against, and whose they are (absent on grades recorded before workshops had their own). */
  thresholds?: BlankThreshold
  source?: ThresholdSource
}

/**
 * A blank's rank from its species' thresholds (the workshop's own when it stored some for
 * the species, else the starting ones): select when every figure meets the select limits,
 * usable when each meets the usable ones, else reject. Without a decay the loss factor is
 * not judged (and says so).
 */
export function gradeFromThresholds(
  figures: { specificModulus: number, lossFactor: number | null },
  species: BarMaterial,
  workshopThresholds: Partial<Record<BarMaterial, BlankThreshold>> = {},
): BlankGrade {
  if (!Number.isFinite(figures.specificModulus)) throw new RangeError('the specific modulus must be a finite number')
  const own = workshopThresholds[species]
  const t = own ?? BLANK_THRESHOLDS[species]
  const reasons: string[] = []
  const rankOf = (select: boolean, usable: boolean): BlankRank => (select ? 'select' : usable ? 'usable' : 'reject')
  const stiffness = rankOf(figures.specificModulus >= t.specificModulus.select, figures.specificModulus >= t.specificModulus.usable)
  if (stiffness !== 'select') {
    reasons.push(`E/ρ of ${figures.specificModulus.toFixed(1)} is below the ${stiffness === 'usable' ? 'select' : 'usable'} limit of ${(stiffness === 'usable' ? t.specificModulus.select : t.specificModulus.usable).toFixed(1)} for ${species}.`)
  }
  let loss: BlankRank = 'select'
  if (figures.lossFactor === null) reasons.push('No decay was given, so the loss factor was not judged.')
  else {
    loss = rankOf(figures.lossFactor <= t.lossFactor.select, figures.lossFactor <= t.lossFactor.usable)
    if (loss !== 'select') {
      reasons.push(`A loss factor of ${figures.lossFactor.toFixed(4)} is above the ${loss === 'usable' ? 'select' : 'usable'} limit of ${(loss === 'usable' ? t.lossFactor.select : t.lossFactor.usable).toFixed(4)} for ${species}.`)
    }
  }
  const rank = BLANK_RANKS[Math.max(BLANK_RANKS.indexOf(stiffness), BLANK_RANKS.indexOf(loss))]!
  return { species, rank, reasons, thresholds: t, source: own ? 'workshop' : 'starting' }
}
