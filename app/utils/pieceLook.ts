import type { PartialState } from '#shared/format/numbers'
import type { PieceStage } from '#shared/records/stages'

/** A piece's latest verdict as a mark: within, sharp or flat by the worst partial's sign, or missing. */
export function pieceState(verdict: string | null | undefined, worstCents: number | null | undefined): PartialState | null {
  if (!verdict) return null
  if (verdict === 'within') return 'within'
  if (verdict === 'incomplete' || worstCents === null || worstCents === undefined) return 'missing'
  return worstCents > 0 ? 'sharp' : 'flat'
}

export const VERDICT_WORDS: Record<string, string> = { within: 'within', outside: 'outside', incomplete: 'incomplete' }

/**
 * Stage colours (our palette): paper tones before tuning, brass while tuned,
 * spruce once signed off, kiln for rework, faint ink when out of the flow.
 * Always shown with the stage's name beside it.
 */
export const STAGE_FILL: Record<PieceStage, string> = {
  blank: '#ece6d9',
  roughed: '#d9d0bd',
  tuning: '#c9a13f',
  review: '#6e5416',
  approved: '#2f7d5b',
  certified: '#1c4f39',
  shipped: '#4a5059',
  rework: '#c45a1c',
  scrapped: '#7b818a',
}

/** Text colour that reads on each stage fill. */
export const STAGE_TEXT: Record<PieceStage, string> = {
  blank: '#1f2329',
  roughed: '#1f2329',
  tuning: '#1f2329',
  review: '#f6f3ec',
  approved: '#f6f3ec',
  certified: '#f6f3ec',
  shipped: '#f6f3ec',
  rework: '#f6f3ec',
  scrapped: '#f6f3ec',
}

export function formatWhen(value: string | Date | null | undefined): string {
  if (!value) return '—'
  const d = new Date(value)
  return d.toLocaleString('en-GB', { day: '2-digit', month: 'short', hour: '2-digit', minute: '2-digit', timeZone: 'UTC' }) + ' UTC'
}
