import { AnalysisError, type AnalysisErrorStatus } from '../../shared/analysis/AnalysisError'
import { analyzeStrike } from '../../shared/analysis/analyzeStrike'
import { calibrateRecording } from '../../shared/calibration/calibrateRecording'
import type { ClockOffset } from '../../shared/calibration/measureClockOffset'
import type { AnalysisResult, AnalyzeOptions } from '../../shared/analysis/types'
import { lowerThreadPriority } from './lowerThreadPriority'

lowerThreadPriority()

/** What the request thread sends: the file's bytes and the engine's options. */
export interface AnalysisTask {
  bytes: Uint8Array
  options: AnalyzeOptions
}

/**
 * What comes back. A refusal crosses the thread boundary as plain data (status, code,
 * sentence) because class identity does not survive structured cloning.
 */
export type AnalysisReply
  = | { ok: true, result: AnalysisResult, json: string }
    | { ok: false, status: AnalysisErrorStatus, code: string, message: string }

/**
 * The pool's task: decode and measure one strike off the request thread. The result also
 * comes back as JSON text, written here once, so the request thread stores and sends it
 * without serialising it again.
 */
export default async function analyze(task: AnalysisTask): Promise<AnalysisReply> {
  try {
    const result = await analyzeStrike(task.bytes, task.options)
    return { ok: true, result, json: JSON.stringify(result) }
  }
  catch (error) {
    if (error instanceof AnalysisError) return { ok: false, status: error.status, code: error.code, message: error.message }
    throw error
  }
}

/** A recorded reference tone and what it is known to be. */
export interface CalibrationTask {
  bytes: Uint8Array
  referenceHz: number
  referenceUncertaintyPpm?: number
}

export type CalibrationReply
  = | { ok: true, offset: ClockOffset }
    | { ok: false, status: AnalysisErrorStatus, code: string, message: string }

/** The pool's second task (piscina's `name: 'calibrate'`): decode and measure a reference tone. */
export async function calibrate(task: CalibrationTask): Promise<CalibrationReply> {
  try {
    const offset = await calibrateRecording(task.bytes, task.referenceHz, { referenceUncertaintyPpm: task.referenceUncertaintyPpm })
    return { ok: true, offset }
  }
  catch (error) {
    if (error instanceof AnalysisError) return { ok: false, status: error.status, code: error.code, message: error.message }
    throw error
  }
}
