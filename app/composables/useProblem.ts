import { ref } from 'vue'
import { apiErrorMessage } from './useApi'

/**
 * A form's problem sentence, and `attempt`, which clears it, runs a request and fills it with the
 * request's failure; `busy` is true while a request runs (to disable the button that started it).
 */
export function useProblem() {
  const problem = ref<string | null>(null)
  const busy = ref(false)
  async function attempt<R>(work: () => Promise<R>): Promise<R | undefined> {
    problem.value = null
    busy.value = true
    try {
      return await work()
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
      return undefined
    }
    finally {
      busy.value = false
    }
  }
  return { problem, busy, attempt }
}
