import { BAR_MATERIALS, type BarMaterial } from '../records/barMaterials'

/** The workshop's hand for one family and material, from its saved plans and the strikes after them. */
export interface HandFactorSummary {
  family: string
  material: BarMaterial
  /** Mean of achieved ÷ model-predicted change of the fundamental; null without plans to learn from. */
  mean: number | null
  /** Sample standard deviation of that ratio; null below two plans. */
  spread: number | null
  count: number
  /** The factor the next plan uses: the mean once enough plans agree, else 1. */
  applied: number
}

/** The plain sentence shown beside a plan about the workshop's hand. */
export function handFactorSentence(hand: HandFactorSummary, minPlans: number): string {
  const what = `${BAR_MATERIALS[hand.material].label.toLowerCase()} ${hand.family}s`
  if (hand.mean === null || hand.count === 0) return `No cut on ${what} has been struck after its plan yet: plans use the model as it is.`
  const plans = `${hand.count} plan${hand.count === 1 ? '' : 's'}`
  const spread = hand.spread === null ? '' : ` (spread ±${hand.spread.toFixed(2)})`
  const learnt = `Your cuts on ${what} move the fundamental ${hand.mean.toFixed(2)}× as much as the model says${spread}, from ${plans}`
  return hand.count < minPlans ? `${learnt}; plans use it from ${minPlans} plans on.` : `${learnt}; this plan allows for it.`
}
