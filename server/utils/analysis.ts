import { AnalysisError } from '../../shared/analysis/AnalysisError'
import { analyzeStrike } from '../../shared/analysis/analyzeStrike'
import { parseAnalyzeOptions } from '../../shared/analysis/parseAnalyzeOptions'
import type { AnalysisResult, AnalyzeOptions } from '../../shared/analysis/types'
import { fail } from './http-errors'

/** Runs the engine; its refusals become HTTP errors with the engine's plain sentence. */
export async function runAnalysis(bytes: Uint8Array, options: AnalyzeOptions): Promise<AnalysisResult> {
  try {
    return await analyzeStrike(bytes, options)
  }
  catch (error) {
    if (error instanceof AnalysisError) fail(error.status, error.message)
    throw error
  }
}

/** The analyze route: options arrive as form fields. */
export async function analyzeUpload(bytes: Uint8Array, fields: Record<string, string>) {
  let options: AnalyzeOptions
  // The CLI's spelling (target-hz) and the JSON spelling (targetHz) both work.
  const camel = Object.fromEntries(Object.entries(fields).map(([k, v]) => [k.replace(/-([a-z])/g, (_, c: string) => c.toUpperCase()), v]))
  try {
    options = parseAnalyzeOptions(camel)
  }
  catch (error) {
    if (error instanceof AnalysisError) fail(error.status, error.message)
    throw error
  }
  return runAnalysis(bytes, options)
}
