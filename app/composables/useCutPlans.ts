import type { InternalApi } from 'nitropack/types'
import { toValue, watch, type MaybeRefOrGetter } from 'vue'

export type CutPlanList = InternalApi['/api/pieces/:id/cut-plans']['get']
export type SavedCutPlanView = CutPlanList['plans'][number]

/**
 * A piece's saved cut plans, its geometry and the workshop's hand; asks again when the piece
 * or its latest strike changes. `planLatest` saves a plan from the latest strike.
 */
export function useCutPlans(pieceId: MaybeRefOrGetter<string>, latestStrikeId: MaybeRefOrGetter<string | null>) {
  const api = useApiFetch()
  const list = ref<CutPlanList | null>(null)
  const problem = ref<string | null>(null)
  const busy = ref(false)

  async function load() {
    try {
      list.value = await api<CutPlanList>(`/api/pieces/${toValue(pieceId)}/cut-plans`)
      problem.value = null
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
    }
  }

  async function planLatest() {
    busy.value = true
    problem.value = null
    try {
      await api(`/api/pieces/${toValue(pieceId)}/cut-plans`, { method: 'POST', body: {} })
      await load()
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
    }
    finally {
      busy.value = false
    }
  }

  const latestPlan = computed(() => list.value?.plans[0] ?? null)
  /** True when the newest strike has no plan yet. */
  const latestUnplanned = computed(() => {
    const strike = toValue(latestStrikeId)
    return Boolean(strike) && latestPlan.value?.strikeId !== strike
  })

  watch(() => [toValue(pieceId), toValue(latestStrikeId)], () => void load(), { immediate: true })
  return { list, problem, busy, latestPlan, latestUnplanned, planLatest, reload: load }
}
