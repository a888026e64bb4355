import type { Role } from '../auth/roles'
import { keysOf } from './lists'

/** Piece stages in workflow order, then the side exits (README.md, Roles and stages). */
export const STAGE_LABELS = {
  blank: 'Blank',
  roughed: 'Roughed',
  tuning: 'Tuning',
  review: 'In review',
  approved: 'Approved',
  certified: 'Certified',
  shipped: 'Shipped',
  rework: 'Rework',
  scrapped: 'Scrapped',
}
export const PIECE_STAGES = keysOf(STAGE_LABELS)
export type PieceStage = (typeof PIECE_STAGES)[number]

/** Stages a benchmaker moves their own pieces between. */
export const BENCH_STAGES: readonly PieceStage[] = ['blank', 'roughed', 'tuning', 'review']

/**
 * Moves made with the plain stage change. Approval, return for rework, reopening,
 * certifying and shipping have their own audited actions.
 */
const MOVES: Record<PieceStage, readonly PieceStage[]> = {
  blank: ['roughed', 'tuning', 'scrapped'],
  roughed: ['blank', 'tuning', 'scrapped'],
  tuning: ['roughed', 'review', 'scrapped'],
  review: ['tuning', 'scrapped'],
  rework: ['tuning', 'scrapped'],
  approved: [],
  certified: [],
  shipped: [],
  scrapped: [],
}

export function allowedMoves(from: PieceStage): readonly PieceStage[] {
  return MOVES[from]
}

/**
 * Why this role may never make a move to `to`, or null: the office does not change
 * stages, and scrapping is a supervisor's or owner's call. (The server answers 403.)
 */
export function stageMoveRoleProblem(role: Role, to: PieceStage): string | null {
  if (role === 'office') return 'The office does not change piece stages.'
  if (role === 'benchmaker' && to === 'scrapped') return 'Only a supervisor or the owner can scrap a piece.'
  return null
}

/**
 * Why a role may not move a piece from one stage to another, or null when it may.
 * Benchmakers move between blank, roughed, tuning and review (and take rework back
 * to tuning); scrapping is a supervisor's or owner's call.
 */
export function stageMoveProblem(role: Role, from: PieceStage, to: PieceStage): string | null {
  if (from === to) return `The piece is already ${STAGE_LABELS[to].toLowerCase()}.`
  if (!MOVES[from].includes(to)) {
    if (from === 'review' && to === 'approved') return 'Approve a piece from the Review screen.'
    if (from === 'approved') return 'An approved piece can only be reopened by a supervisor, with a reason.'
    return `A piece cannot go from ${STAGE_LABELS[from].toLowerCase()} to ${STAGE_LABELS[to].toLowerCase()}.`
  }
  return stageMoveRoleProblem(role, to)
}

/** Stages in which a strike may be recorded. */
export const STRIKEABLE_STAGES: readonly PieceStage[] = ['blank', 'roughed', 'tuning', 'rework', 'review']

/** True for a value that is one of the piece stages (narrows a plain string). */
export function isPieceStage(value: unknown): value is PieceStage {
  return typeof value === 'string' && (PIECE_STAGES as readonly string[]).includes(value)
}

/** Whether a strike may be recorded on a piece in this stage. */
export function isStrikeable(stage: string): boolean {
  return isPieceStage(stage) && STRIKEABLE_STAGES.includes(stage)
}

/**
 * Stages past a supervisor's approval: the piece counts as done (dashboard), is ready
 * for its set's certificate, and its signed verdict never moves on re-measurement.
 */
export const FINISHED_STAGES: readonly PieceStage[] = ['approved', 'certified', 'shipped']

export function isFinished(stage: string): boolean {
  return isPieceStage(stage) && FINISHED_STAGES.includes(stage)
}

/** Stages the benchmaker is still working in: strikeable and not waiting for a supervisor. */
export const AT_BENCH_STAGES: readonly PieceStage[] = STRIKEABLE_STAGES.filter(s => s !== 'review')

/** Every stage a plain stage change can lead to (the choices of a bulk change). */
export const MOVE_TARGETS: readonly PieceStage[] = PIECE_STAGES.filter(s => PIECE_STAGES.some(from => MOVES[from].includes(s)))

/** The stage a piece is in after a strike: a blank or returned piece is being tuned; roughing and review stay. */
export function stageAfterStrike(stage: PieceStage): PieceStage {
  return stage === 'blank' || stage === 'rework' ? 'tuning' : stage
}

/** Why a piece may not arrive in `to` yet, or null: review needs at least one strike. */
export function arrivalProblem(to: PieceStage, strikeCount: number): string | null {
  return to === 'review' && strikeCount === 0 ? 'has no strike yet: record one before sending it to review.' : null
}

/**
 * Why this member may not work on a piece with this assignee, or null: a benchmaker
 * works only on unassigned pieces and their own. (The server answers 403.)
 */
export function assigneeProblem(role: Role, userId: string, assigneeId: string | null): string | null {
  return role === 'benchmaker' && assigneeId !== null && assigneeId !== userId ? 'is assigned to someone else.' : null
}

/** The assignee after a member works on a piece: a benchmaker takes an unassigned piece; an assignment is never replaced. */
export function assigneeAfter(role: Role, userId: string, assigneeId: string | null): string | null {
  return assigneeId ?? (role === 'benchmaker' ? userId : null)
}

/** A supervisor's decisions, each its own audited action: the stage it starts from and the one it leads to. */
export const DECISION_MOVES = {
  approve: { from: 'review', to: 'approved' },
  return: { from: 'review', to: 'rework' },
  reopen: { from: 'approved', to: 'tuning' },
} as const satisfies Record<string, { from: PieceStage, to: PieceStage }>

/**
 * Composite moves: a stage reached through another one in one change (one request,
 * one transaction). A piece goes to review through tuning, so the Bench sends a blank,
 * roughed or returned piece to review in one step.
 */
export const COMPOSITE_MOVES: Partial<Record<PieceStage, PieceStage>> = { review: 'tuning' }

/** Whether `via` is the declared middle stage of a composite move to `to`. */
export function isCompositeMove(to: PieceStage, via: PieceStage): boolean {
  return COMPOSITE_MOVES[to] === via
}

/**
 * The plain moves that take a piece from `from` to `to` (through `via` when given, and
 * only when the piece is not there already), or the problem with the first one that
 * may not be made: `status` 403 for what the role may never do, 409 for what the
 * piece's stage does not allow.
 */
export function stagePath(role: Role, from: PieceStage, to: PieceStage, via?: PieceStage):
  { steps: PieceStage[], problem: null } | { steps: null, problem: string, status: 403 | 409 } {
  const roleProblem = stageMoveRoleProblem(role, to) ?? (via ? stageMoveRoleProblem(role, via) : null)
  if (roleProblem) return { steps: null, problem: roleProblem, status: 403 }
  const steps: PieceStage[] = via && from !== via && from !== to ? [via, to] : [to]
  let at = from
  for (const step of steps) {
    const problem = stageMoveProblem(role, at, step)
    if (problem) return { steps: null, problem, status: 409 }
    at = step
  }
  return { steps, problem: null }
}
