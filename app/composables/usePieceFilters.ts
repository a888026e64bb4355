import type { LocationQuery } from 'vue-router'
import { queryWriter } from '../utils/queryWriter'

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

/** Writes filter changes to the URL; any change but the page itself goes back to page 1. */
export function filterWriter(read: () => PieceFilters, write: (query: Record<string, string>) => Promise<unknown>) {
  return queryWriter<PieceFilters>({
    read,
    toQuery: pieceFilterQuery,
    write,
    adjust: (next, patch) => ('page' in patch ? next : { ...next, page: 1 }),
  })
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
