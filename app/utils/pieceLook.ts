import { PIECE_STAGES, type PieceStage } from '#shared/records/stages'
import { isOneOf, PIECE_VERDICTS, type PartialState } from '#shared/records/lists'
import { lookClasses, lookHex, MEANINGS, STAGE_MEANING, verdictMeaning, type Meaning } from '#shared/look/meanings'

/** A piece's latest verdict as a mark: within, sharp or flat by the worst partial's sign, or missing. */
export function pieceState(verdict: string | null | undefined, worstCents: number | null | undefined): PartialState | null {
  if (!isOneOf(PIECE_VERDICTS, verdict)) return null
  return verdictMeaning(verdict, worstCents)
}

export const VERDICT_WORDS: Record<string, string> = Object.fromEntries(PIECE_VERDICTS.map(v => [v, v]))

/** Stage colours from the meaning map; always shown with the stage's name beside them. */
export const STAGE_FILL = Object.fromEntries(PIECE_STAGES.map(s => [s, lookHex(STAGE_MEANING[s]).colour])) as Record<PieceStage, string>

/** Text colour that reads on each stage fill. */
export const STAGE_TEXT = Object.fromEntries(PIECE_STAGES.map(s => [s, lookHex(STAGE_MEANING[s]).onColour])) as Record<PieceStage, string>

/** A meaning's Tailwind classes, for templates: `lookOf('error').text`. */
export function lookOf(meaning: Meaning) {
  return lookClasses(meaning)
}

/** The word shown for a partial state (within, sharp, flat, missing). */
export function stateWord(state: PartialState): string {
  return MEANINGS[state].word
}
