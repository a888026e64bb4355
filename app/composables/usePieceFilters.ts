import type { LocationQuery } from 'vue-router'

export interface PieceFilters {
  set: string
  stage: string
  verdict: string
  assignee: string
  q: string
  sort: string
  page: number
}

const DEFAULTS: PieceFilters = { set: '', stage: '', verdict: '', assignee: '', q: '', sort: 'position', page: 1 }
export const PIECE_PAGE_SIZE = 25

const text = (v: LocationQuery[string] | undefined) => (Array.isArray(v) ? v[0] : v) ?? ''

/** The URL query of some filters: defaults and empty ones left out. */
export function pieceFilterQuery(filters: PieceFilters): Record<string, string> {
  const query: Record<string, string> = {}
  for (const [key, value] of Object.entries(filters)) {
    if (value !== '' && value !== DEFAULTS[key as keyof PieceFilters]) query[key] = String(value)
  }
  return query
}

/**
 * Writes filter changes to the URL. A change made before the last one has reached the route
 * (two selects changed in quick succession) builds on that last one, not on the route, which
 * would still show the filters before it and so undo it.
 */
export function filterWriter(read: () => PieceFilters, write: (query: Record<string, string>) => Promise<unknown>) {
  let pending: PieceFilters | null = null
  return (patch: Partial<PieceFilters>) => {
    const next = { ...(pending ?? read()), ...patch }
    // Any change but the page itself goes back to page 1.
    if (!('page' in patch)) next.page = 1
    pending = next
    const done = () => {
      if (pending === next) pending = null
    }
    return write(pieceFilterQuery(next)).then(done, done)
  }
}

/**
 * The Pieces table's filters live in the URL query, so a filtered page can be
 * shared or bookmarked. Reads come from the route; writes replace the query.
 */
export function usePieceFilters() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed<PieceFilters>(() => ({
    set: text(route.query.set),
    stage: text(route.query.stage),
    verdict: text(route.query.verdict),
    assignee: text(route.query.assignee),
    q: text(route.query.q),
    sort: text(route.query.sort) || DEFAULTS.sort,
    page: Math.max(1, Number.parseInt(text(route.query.page) || '1', 10) || 1),
  }))

  /** The API query: empty filters left out. */
  const apiQuery = computed(() => {
    const f = filters.value
    const out: Record<string, string | number> = { sort: f.sort, page: f.page, pageSize: PIECE_PAGE_SIZE }
    for (const key of ['set', 'stage', 'verdict', 'assignee', 'q'] as const) if (f[key]) out[key] = f[key]
    return out
  })

  /** Changes some filters; any change but the page itself goes back to page 1. */
  const update = filterWriter(() => filters.value, query => router.replace({ query }))

  return { filters, apiQuery, update }
}
