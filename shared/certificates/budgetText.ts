import type { z } from 'zod'
import type { CertificateBudgetSchema } from '../schemas/certificateContent'
import { ASSUMED_TEMPERATURE_HALF_WIDTH_K, statesExpandedUncertainty, STORED_RESOLUTION_CENTS } from '../uncertainty/evidence'
import { roundUpCents } from './uncertaintyText'

type FrozenBudget = z.output<typeof CertificateBudgetSchema>

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`

function median(sorted: number[]): number {
  const mid = Math.floor(sorted.length / 2)
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2
}

/** The component that most often gives a budget's largest contribution. */
function usualLargest(budgets: FrozenBudget[]): string | null {
  const count = new Map<string, number>()
  for (const b of budgets) {
    const top = [...b.lines].sort((x, y) => y.contribution - x.contribution)[0]
    if (top) count.set(top.name, (count.get(top.name) ?? 0) + 1)
  }
  return [...count.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))[0]?.[0] ?? null
}

function rangeSentence(sorted: number[]): string {
  const [low, high] = [roundUpCents(sorted[0]!), roundUpCents(sorted[sorted.length - 1]!)]
  const over = `Over the ${plural(sorted.length, 'partial', 'partials')} with a budget`
  return low === high ? `${over}, U is ±${high} ¢.` : `${over}, U is between ±${low} ¢ and ±${high} ¢ (typically ±${roundUpCents(median(sorted))} ¢).`
}

export const NOT_ACCREDITED = 'Tonewright is not an accredited calibration laboratory: this statement follows the method of the GUM but is the workshop\'s own, not an accredited calibration certificate.'

/**
 * The certificate's uncertainty paragraph computed from the frozen budgets (JCGM 100:2008
 * §5, §6, k = 2), in plain words: what was combined, the range of U, the usual largest
 * component, what could not be assessed, and that Tonewright is not an accredited laboratory.
 */
export function budgetUncertaintyText(pieces: { budget: FrozenBudget[] }[]): string {
  const all = pieces.flatMap(p => p.budget)
  const budgets = all.filter(b => statesExpandedUncertainty(b.notAssessed))
  if (!budgets.length) return `No partial was measured with a budget, so no measurement uncertainty is stated. ${NOT_ACCREDITED}`
  const expanded = budgets.map(b => b.expandedUncertaintyCents).sort((a, b) => a - b)
  const parts = [
    'Each deviation in the results carries its expanded uncertainty U (written ± beside it), computed for each partial from an uncertainty budget in the manner of the GUM (JCGM 100:2008).',
    `The budget combines the repeatability over the strikes of the piece's final form (Type A), the measurement engine's own estimate for the partial, the sound input's clock calibration and its drift since then, the bench temperature (±${ASSUMED_TEMPERATURE_HALF_WIDTH_K} °C assumed, times the template's temperature coefficient) and the ${STORED_RESOLUTION_CENTS} ¢ resolution of the stated result (Type B), as the root sum of squares u; U = 2u covers about 95 %.`,
    rangeSentence(expanded),
  ]
  const largest = usualLargest(budgets)
  if (largest) parts.push(`The largest component is most often the ${largest}.`)
  const gaps = new Map<string, number>()
  for (const b of budgets) for (const g of b.notAssessed) gaps.set(g.name, (gaps.get(g.name) ?? 0) + 1)
  if (gaps.size) {
    const list = [...gaps.entries()].sort((a, b) => a[0].localeCompare(b[0])).map(([name, n]) => `the ${name} for ${plural(n, 'partial', 'partials')}`).join(', ')
    parts.push(`Not assessed for want of evidence, and so left out of U rather than guessed: ${list}; there U understates the doubt.`)
  }
  const unstated = all.length - budgets.length
  if (unstated) parts.push(`For ${plural(unstated, 'partial', 'partials')} measured by an engine that gave no estimate of its own, no U is stated; the annex shows the rest of their budgets.`)
  parts.push('The annex lists every budget.', NOT_ACCREDITED)
  return parts.join(' ')
}
