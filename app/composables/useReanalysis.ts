import type { ReanalysisResult } from '#shared/reanalysis/types'
import type { ReanalysisScope, ReanalysisStatus } from '#shared/records/lists'
import { toValue, type MaybeRefOrGetter } from 'vue'

export interface ReanalysisRunView {
  id: string
  scope: ReanalysisScope
  setId: string
  pieceId: string | null
  status: ReanalysisStatus
  engineVersion: string
  requestedAt: string
  finishedAt: string | null
  error: string | null
  statusUrl: string
  result: ReanalysisResult | null
}

/**
 * A set's or a piece's latest re-measurement: start one, follow it until it ends, then tell the page.
 * `load` false: nothing is asked on mount (a member who may not re-measure).
 */
export function useReanalysis(scope: ReanalysisScope, id: string, onFinished: () => void, load: MaybeRefOrGetter<boolean> = true) {
  const api = useApiFetch()
  const run = ref<ReanalysisRunView | null>(null)
  const problem = ref<string | null>(null)
  const busy = ref(false)
  let timer: ReturnType<typeof setTimeout> | null = null
  const active = computed(() => run.value?.status === 'queued' || run.value?.status === 'running')

  function follow() {
    if (timer) clearTimeout(timer)
    if (!active.value || !run.value) return
    timer = setTimeout(async () => {
      try {
        run.value = await api<ReanalysisRunView>(run.value!.statusUrl)
        if (!active.value) onFinished()
      }
      catch (error) {
        problem.value = apiErrorMessage(error)
      }
      follow()
    }, 1000)
  }

  async function loadLatest() {
    try {
      run.value = (await api<{ run: ReanalysisRunView | null }>('/api/reanalysis', { query: { [scope]: id } })).run
      follow()
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
    }
  }

  async function start() {
    busy.value = true
    problem.value = null
    try {
      run.value = await api<ReanalysisRunView>(`/api/${scope === 'set' ? 'sets' : 'pieces'}/${id}/reanalyze`, { method: 'POST', body: {} })
      follow()
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
    }
    finally {
      busy.value = false
    }
  }

  onMounted(() => {
    if (toValue(load)) void loadLatest()
  })
  onBeforeUnmount(() => {
    if (timer) clearTimeout(timer)
  })
  return { run, problem, busy, active, start }
}
