import type { InternalApi } from 'nitropack/types'
import type { BarMaterial } from '#shared/records/barMaterials'

export type BlankRow = InternalApi['/api/blanks']['get'][number]

/** The workshop's graded blanks (newest first), of one species and one lot when given. */
export function useBlanks(filter: MaybeRefOrGetter<{ species?: BarMaterial, lotId?: string }>) {
  const query = computed(() => {
    const f = toValue(filter)
    return { ...(f.species ? { species: f.species } : {}), ...(f.lotId ? { lotId: f.lotId } : {}) }
  })
  const { data, error, status, refresh } = useFetch<BlankRow[]>('/api/blanks', { query })
  return { blanks: computed(() => data.value ?? []), error, pending: computed(() => status.value === 'pending'), refresh }
}
