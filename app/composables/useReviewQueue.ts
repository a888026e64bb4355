import type { LocationQuery } from 'vue-router'
import { REVIEW_GROUPINGS, type ReviewGrouping } from '#shared/schemas/review'
import { queryWriter } from '../utils/queryWriter'

export interface ReviewFilters { set: string, benchmaker: string, group: ReviewGrouping | '' }

const text = (v: LocationQuery[string] | undefined) => (Array.isArray(v) ? v[0] : v) ?? ''
const grouping = (v: string): ReviewGrouping | '' => ((REVIEW_GROUPINGS as readonly string[]).includes(v) ? v as ReviewGrouping : '')

/** The URL query of some review filters: empty ones left out. */
export function reviewFilterQuery(filters: ReviewFilters): Record<string, string> {
  const query: Record<string, string> = {}
  for (const [key, value] of Object.entries(filters)) if (value) query[key] = value
  return query
}

/**
 * The review queue as the desk shows it: filtered and grouped by what the URL says (so a
 * filtered queue can be bookmarked), with the choices of its filters. When grouped, the
 * queue is in group order, oldest first within a group, and j/k follow that order.
 */
export async function useReviewQueue() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed<ReviewFilters>(() => ({
    set: text(route.query.set), benchmaker: text(route.query.benchmaker), group: grouping(text(route.query.group)),
  }))
  const apiQuery = computed(() => {
    const out: Record<string, string> = {}
    if (filters.value.set) out.set = filters.value.set
    if (filters.value.benchmaker) out.benchmaker = filters.value.benchmaker
    return out
  })
  const [queueFetch, choicesFetch] = await Promise.all([
    useFetch('/api/review', { key: 'review-queue', query: apiQuery }),
    useFetch('/api/review/filters', { key: 'review-filters' }),
  ])
  function groupKey(item: { setId: string, setName: string, assigneeId: string | null, assigneeName: string | null }) {
    if (filters.value.group === 'set') return { key: item.setId, label: item.setName }
    if (filters.value.group === 'benchmaker') return { key: item.assigneeId ?? 'none', label: item.assigneeName ?? 'Unassigned' }
    return null
  }
  const groups = computed(() => {
    const out: { key: string, label: string | null, items: NonNullable<typeof queueFetch.data.value> }[] = []
    for (const item of queueFetch.data.value ?? []) {
      const g = groupKey(item)
      const found = out.find(o => o.key === (g?.key ?? ''))
      if (found) found.items.push(item)
      else out.push({ key: g?.key ?? '', label: g?.label ?? null, items: [item] })
    }
    return out
  })
  const items = computed(() => groups.value.flatMap(g => g.items))

  const update = queryWriter<ReviewFilters>({ read: () => filters.value, toQuery: reviewFilterQuery, write: query => router.replace({ query }) })
  async function refresh() {
    await Promise.all([queueFetch.refresh(), choicesFetch.refresh()])
  }
  return { filters, update, items, groups, choices: choicesFetch.data, error: queueFetch.error, refresh }
}
