import { reactive } from 'vue'

export interface RecordPageSpec<T> {
  /** The record's name: the page's heading unless the page draws its own, and the tab's title. */
  name: (record: T) => string
  /** The tab's title while nothing is loaded. */
  fallback: string
  /** The way back: a link and where the record sits. */
  crumb: (record: T) => { to: string, label: string, trail: string }
}

/**
 * A record's own page (a piece, a set, a template): the record the route's id names, the tab's
 * title from it, and what DetailPage takes (`v-bind="page"`: the record, the load error, its
 * name and its way back).
 */
export async function useRecordPage<T>(collection: 'pieces' | 'sets' | 'templates' | 'lots', spec: RecordPageSpec<T>) {
  const id = String(useRoute().params.id)
  const fetched = useFetch<T>(`/api/${collection}/${id}`, { key: `${collection}-${id}` })
  useHead({ title: () => `${fetched.data.value ? spec.name(fetched.data.value as T) : spec.fallback} · Tonewright` })
  const { data, error, refresh } = await fetched
  return { page: reactive({ record: data, error, name: spec.name, crumb: spec.crumb }), record: data, refresh }
}
