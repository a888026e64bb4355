import { and, desc, eq, sql } from 'drizzle-orm'
import { cutPlans, pieces, strikes } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { handFactorSentence } from '../../shared/barModel/handFactorSentence'
import { BAR_MODEL_VERSION } from '../../shared/barModel/version'
import { StoredMatchesSchema } from '../../shared/schemas/analysis'
import { CUT_PLAN_LIMITS, type CutPlanInput } from '../../shared/schemas/cutPlan'
import type { CutPlanRequest } from '../../shared/schemas/savedCutPlan'
import type { Member } from './auth'
import { planCutsOffThread } from './bar-model'
import { HAND_FACTOR_MIN_PLANS, handFactorFor } from './hand-factor'
import { fail, isUniqueViolation } from './http-errors'
import { resolvePieceGeometry } from './piece-geometry'

/** Saved plans shown on a piece, newest first. */
const LISTED_PLANS = 20

/** The strike a plan starts from: the one asked for (of this piece), else the piece's latest. */
async function strikeToPlanFrom(db: Executor, workshopId: string, pieceId: string, strikeId: string | undefined) {
  const where = strikeId
    ? and(eq(strikes.id, strikeId), eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId))
    : and(eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId))
  const [strike] = await db.select({
    id: strikes.id, engineVersion: strikes.engineVersion,
    matches: sql<unknown>`${strikes.analysis} -> 'matches'`.mapWith(v => StoredMatchesSchema.parse(v)),
  })
    .from(strikes).where(where).orderBy(desc(strikes.createdAt)).limit(1)
  if (!strike) fail(strikeId ? 404 : 409, strikeId ? 'No such strike of this piece.' : 'This piece has no strike yet: strike it first, then ask for a plan.')
  return strike
}

/** The tuned partials the strike found, lowest ratio first, as many as the planner takes. */
function plannedPartials(matches: ReturnType<typeof StoredMatchesSchema.parse>) {
  const found = (matches ?? []).filter(m => m.required && !m.missing && m.cents !== null)
  if (found.length === 0) fail(422, 'The strike found none of the template\'s tuned partials, so there is nothing to plan from: strike the piece again.')
  return found.sort((a, b) => a.ratio - b.ratio).slice(0, CUT_PLAN_LIMITS.partials)
    .map(m => ({ ratio: m.ratio, cents: m.cents!, toleranceCents: Math.max(CUT_PLAN_LIMITS.toleranceCents[0], m.toleranceCents) }))
}

async function existingPlan(db: Executor, workshopId: string, strikeId: string) {
  const [row] = await db.select().from(cutPlans).where(and(eq(cutPlans.strikeId, strikeId), eq(cutPlans.workshopId, workshopId)))
  return row
}

/**
 * Plans cuts for a piece from one of its strikes and saves the plan with that strike (one
 * plan per strike: asking again, or at the same time, answers the saved one). The work runs
 * in the bar model's worker; the workshop's hand factor for the family and material is applied.
 */
export async function saveCutPlan(db: Database, member: Member, pieceId: string, request: CutPlanRequest) {
  const resolved = await resolvePieceGeometry(db, member.workshopId, pieceId)
  const strike = await strikeToPlanFrom(db, member.workshopId, pieceId, request.strikeId)
  const saved = await existingPlan(db, member.workshopId, strike.id)
  if (saved) return { plan: saved, created: false }
  if (!resolved.geometry || !resolved.material) fail(422, resolved.problem ?? 'This piece has no geometry for the bar model.')
  const partials = plannedPartials(strike.matches)
  const hand = await handFactorFor(db, member.workshopId, resolved.family, resolved.material)
  const input: CutPlanInput = { ...resolved.geometry, partials }
  const plan = await planCutsOffThread(input, hand.applied)
  const fundamental = plan.predicted[0]!
  const values = {
    workshopId: member.workshopId, pieceId, strikeId: strike.id, family: resolved.family, material: resolved.material,
    geometry: resolved.geometry, modesHz: plan.modesHz, stations: plan.stations,
    predicted: plan.predicted.map((p, i) => ({ ...p, toleranceCents: partials[i]!.toleranceCents })),
    feasible: plan.feasible, note: plan.note ?? null, handFactor: hand.applied, handFactorPlans: hand.count,
    modelFundamentalChangeCents: (fundamental.centsAfter - fundamental.centsBefore) / hand.applied,
    modelVersion: BAR_MODEL_VERSION, engineVersion: strike.engineVersion, createdBy: member.userId,
  }
  try {
    const [row] = await db.insert(cutPlans).values(values).returning()
    return { plan: row!, created: true }
  }
  catch (error) {
    // Another request saved a plan for this strike first: that one stands.
    if (!isUniqueViolation(error, 'cut_plans_strike_key')) throw error
    const winner = await existingPlan(db, member.workshopId, strike.id)
    if (!winner) throw error
    return { plan: winner, created: false }
  }
}

/** A piece's saved plans (newest first), its geometry and the workshop's hand for its family and material. */
export async function listCutPlans(db: Executor, workshopId: string, pieceId: string) {
  const geometry = await resolvePieceGeometry(db, workshopId, pieceId)
  const [plans, [latest]] = await Promise.all([
    db.select().from(cutPlans).where(and(eq(cutPlans.pieceId, pieceId), eq(cutPlans.workshopId, workshopId)))
      .orderBy(desc(cutPlans.createdAt)).limit(LISTED_PLANS),
    db.select({ id: pieces.latestStrikeId }).from(pieces).where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId))),
  ])
  const hand = geometry.material ? await handFactorFor(db, workshopId, geometry.family, geometry.material) : null
  return {
    geometry,
    latestStrikeId: latest?.id ?? null,
    plans,
    hand: hand && { ...hand, sentence: handFactorSentence(hand, HAND_FACTOR_MIN_PLANS) },
  }
}
