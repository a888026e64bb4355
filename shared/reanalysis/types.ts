import type { ResultChange } from './compareResults'

/** One strike of a re-measurement: what changed, or why it could not be measured. */
export interface ReanalysedStrike {
  strikeId: string
  recordedAt: string
  /** True when the new result became the strike's current one (false on signed pieces, and on failure). */
  applied: boolean
  /** A plain sentence when the strike could not be re-measured (recording missing, engine refusal). */
  error: string | null
  change: ResultChange | null
}

/** One piece of a re-measurement. */
export interface ReanalysedPiece {
  pieceId: string
  position: number
  note: string
  stage: string
  /**
   * Approved, certified or shipped: the new results are kept in the history and shown,
   * but the strikes keep the result the piece was signed on and the stage does not move.
   */
  signed: boolean
  /** The piece's latest-strike verdict and worst cents before and after (after = before on signed pieces). */
  oldVerdict: string | null
  newVerdict: string | null
  oldWorstCents: number | null
  newWorstCents: number | null
  changed: boolean
  strikes: ReanalysedStrike[]
}

/** What a re-measurement found, filled in piece by piece as it runs (`done` at the end). */
export interface ReanalysisResult {
  engineVersion: string
  strikeCount: number
  pieceCount: number
  done: boolean
  pieces: ReanalysedPiece[]
}
