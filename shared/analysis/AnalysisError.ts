/** HTTP-like status of a refused input: 400 bad option, 413 too large, 415 not audio, 422 not measurable. */
export type AnalysisErrorStatus = 400 | 413 | 415 | 422

/**
 * The one error the engine throws for bad input. `message` is a single plain sentence
 * meant for the person at the bench; `code` is a stable machine-readable key.
 */
export class AnalysisError extends Error {
  readonly status: AnalysisErrorStatus
  readonly code: string

  constructor(status: AnalysisErrorStatus, code: string, message: string) {
    super(message)
    this.name = 'AnalysisError'
    this.status = status
    this.code = code
  }
}
