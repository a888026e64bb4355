/**
 * Writes a screen's filters to the URL query. A change made before the last one has reached
 * the route (two selects changed in quick succession) builds on that last one, not on the
 * route, which would still show the filters before it and so undo it.
 */
export function queryWriter<F extends object>(options: {
  read: () => F
  toQuery: (filters: F) => Record<string, string>
  write: (query: Record<string, string>) => Promise<unknown>
  /** Adjusts the next filters for the patch that made them (a new filter goes back to page 1, say). */
  adjust?: (next: F, patch: Partial<F>) => F
}) {
  const { read, toQuery, write, adjust = next => next } = options
  let pending: F | null = null
  return (patch: Partial<F>) => {
    const next = adjust({ ...(pending ?? read()), ...patch }, patch)
    pending = next
    const done = () => {
      if (pending === next) pending = null
    }
    return write(toQuery(next)).then(done, done)
  }
}
