import { sql } from 'drizzle-orm'
import type { Executor } from '../database/client'
import type { HandFactorSummary } from '../../shared/barModel/handFactorSentence'
import type { BarMaterial } from '../../shared/records/barMaterials'
import type { TemplateFamily } from '../../shared/records/lists'

/** Plans learnt from before the hand factor is applied. */
export const HAND_FACTOR_MIN_PLANS = 3
/** The most recent plans learnt from: the hand changes as people and tools do. */
const RECENT_PLANS = 200
/** Smaller predicted changes of the fundamental (¢) say more about measurement noise than about the hand. */
const MIN_MODEL_CHANGE_CENTS = 2
/** A factor outside this range says a plan was not followed; it is never applied. */
const APPLIED_RANGE = [0.25, 4] as const

/**
 * The workshop's hand for a family and material, from the saved rows: for each plan with the
 * strike that came next on its piece, the achieved change of the fundamental
 * (1200 · log2(f next / f planned from)) over the model's own predicted change.
 */
export async function handFactorFor(db: Executor, workshopId: string, family: TemplateFamily, material: BarMaterial): Promise<HandFactorSummary> {
  const rows = await db.execute<{ mean: number | null, spread: number | null, count: number }>(sql`
    select avg(r)::float8 as mean, stddev_samp(r)::float8 as spread, count(r)::int as count from (
      select (1200 * ln(n.fundamental_hz / s.fundamental_hz) / ln(2)) / p.model_fundamental_change_cents as r
      from cut_plans p
      join strikes s on s.id = p.strike_id
      join lateral (
        select x.fundamental_hz from strikes x
        where x.piece_id = p.piece_id and x.created_at > p.created_at
        order by x.created_at limit 1
      ) n on true
      where p.workshop_id = ${workshopId} and p.family = ${family} and p.material = ${material}
        and abs(p.model_fundamental_change_cents) >= ${MIN_MODEL_CHANGE_CENTS}
        and s.fundamental_hz > 0 and n.fundamental_hz > 0
      order by p.created_at desc limit ${RECENT_PLANS}
    ) ratios`)
  const mean = rows[0]?.mean ?? null
  const spread = rows[0]?.spread ?? null
  const count = rows[0]?.count ?? 0
  const usable = mean !== null && count >= HAND_FACTOR_MIN_PLANS && mean >= APPLIED_RANGE[0] && mean <= APPLIED_RANGE[1]
  return { family, material, mean, spread, count, applied: usable ? mean : 1 }
}
