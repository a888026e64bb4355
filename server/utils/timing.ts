/**
 * Runs `work` and answers no sooner than `ms` after it began, so an answer's
 * timing does not tell a known record from an unknown one.
 */
export async function withMinimumDuration<T>(ms: number, work: () => Promise<T>): Promise<T> {
  const started = Date.now()
  try {
    return await work()
  }
  finally {
    const left = ms - (Date.now() - started)
    if (left > 0) await new Promise(resolve => setTimeout(resolve, left))
  }
}
