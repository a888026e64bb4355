import { BLANK_GRADE_LIMITS, BlankStrikeFieldsSchema } from '../../shared/schemas/blankGrade'
import type { BlankThresholds } from '../../shared/schemas/blankThresholds'
import { measureStrike } from './analysis'
import { gradeBlankOffThread } from './bar-model'
import { fail, validateInput } from './http-errors'

/**
 * A blank graded from a recording of its strike: the fields are checked before any work,
 * the engine measures the strike in the analysis pool (decode and limits as for any strike),
 * and its fundamental and that partial's decay go to the bar model.
 */
export async function gradeBlankStrike(bytes: Uint8Array, fields: Record<string, string>, workshopThresholds: BlankThresholds = {}) {
  const blank = validateInput(BlankStrikeFieldsSchema, fields)
  const { result } = await measureStrike(bytes, {})
  const f1Hz = result.fundamentalHz
  const [lowest, highest] = BLANK_GRADE_LIMITS.f1Hz
  if (f1Hz === null || !(f1Hz >= lowest && f1Hz <= highest)) {
    fail(422, 'No ringing mode was found in this recording: strike the blank on its supports and record it again.')
  }
  const partial = result.partials.find(p => p.frequencyHz === f1Hz)
  const decay = partial?.decayDbPerS
  const decayDbPerS = decay !== undefined && decay > 0 && decay <= BLANK_GRADE_LIMITS.decayDbPerS[1] ? decay : undefined
  return { ...(await gradeBlankOffThread({ ...blank, f1Hz, decayDbPerS }, workshopThresholds)), f1Hz, decayDbPerS: decayDbPerS ?? null }
}
