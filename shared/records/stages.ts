import type { Role } from '../auth/roles'

/** Piece stages in workflow order, then the side exits (README.md, Roles and stages). */
export const PIECE_STAGES = ['blank', 'roughed', 'tuning', 'review', 'approved', 'certified', 'shipped', 'rework', 'scrapped'] as const
export type PieceStage = (typeof PIECE_STAGES)[number]

export const STAGE_LABELS: Record<PieceStage, string> = {
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
