import { createError } from 'h3'
import { AnalysisError } from '../../shared/analysis/AnalysisError'
import { parseAnalyzeOptions } from '../../shared/analysis/parseAnalyzeOptions'
import type { AnalysisResult, AnalyzeOptions } from '../../shared/analysis/types'
import { AnalysisBusyError, useAnalysisPool, type MeasuredStrike } from './analysis-pool'
import type { Executor } from '../database/client'
import { appliedCalibration, calibrationInUse } from './calibration-views'
import { fail } from './http-errors'

/**
 * Runs the engine in the worker pool; its refusals become HTTP errors with the engine's
 * plain sentence, and a full queue answers 503 (the `Retry-After` header is set by the
 * analysis-pool plugin from `data.retryAfterS`).
 */
export async function runAnalysis(bytes: Uint8Array, options: AnalyzeOptions): Promise<AnalysisResult> {
  return (await measureStrike(bytes, options)).result
}

/** As runAnalysis, with the result's JSON text as the worker wrote it (to store and send without serialising again). */
export async function measureStrike(bytes: Uint8Array, options: AnalyzeOptions): Promise<MeasuredStrike> {
  try {
    return await useAnalysisPool().measure(bytes, options)
  }
  catch (error) {
    throwPoolError(error)
  }
}

/** A pool task's failure as the HTTP error it means: the engine's refusal with its sentence, a full queue 503. */
export function throwPoolError(error: unknown): never {
  if (error instanceof AnalysisError) fail(error.status, error.message)
  if (error instanceof AnalysisBusyError) {
    throw createError({ statusCode: 503, statusMessage: 'Service Unavailable', message: error.message, data: { retryAfterS: error.retryAfterS } })
  }
  throw error
}

/**
 * The analyze route: options arrive as form fields, and `calibration-id` names the input
 * calibration to correct the frequencies with (checked against the workshop before any
 * measuring). Answers the result's JSON text, with `calibration` and `calibrationExpired`
 * in front when one was applied.
 */
export async function analyzeUpload(db: Executor, workshopId: string, bytes: Uint8Array, fields: Record<string, string>): Promise<string> {
  let options: AnalyzeOptions
  // The CLI's spelling (target-hz) and the JSON spelling (targetHz) both work.
  const camel = Object.fromEntries(Object.entries(fields).map(([k, v]) => [k.replace(/-([a-z])/g, (_, c: string) => c.toUpperCase()), v]))
  if (camel.clockOffsetPpm !== undefined) fail(400, 'The clock offset comes from a stored calibration: send calibration-id instead.')
  try {
    options = parseAnalyzeOptions(camel)
  }
  catch (error) {
    if (error instanceof AnalysisError) fail(error.status, error.message)
    throw error
  }
  const calibration = await calibrationInUse(db, workshopId, fields)
  if (!calibration) return (await measureStrike(bytes, options)).json
  const { json } = await measureStrike(bytes, { ...options, clockOffsetPpm: calibration.offsetPpm })
  // The worker's text is one JSON object: the two fields go in front without parsing it again.
  return `{"calibration":${JSON.stringify(appliedCalibration(calibration))},"calibrationExpired":${calibration.expired},${json.slice(1)}`
}
