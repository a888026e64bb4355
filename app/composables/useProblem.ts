import { ref } from 'vue'
import { apiErrorMessage } from './useApi'

/** A form's problem sentence, and `attempt`, which clears it, runs a request and fills it with the request's failure. */
export function useProblem() {
  const problem = ref<string | null>(null)
  async function attempt<R>(work: () => Promise<R>): Promise<R | undefined> {
    problem.value = null
    try {
      return await work()
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
      return undefined
    }
  }
  return { problem, attempt }
}
