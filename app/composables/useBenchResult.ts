import type { AnalysisResult } from '#shared/analysis/types'
import { useBenchStore, type StrikeAudio } from '~/stores/bench'

interface StrikeOnScreen { id: string, createdAt: string, analysis: AnalysisResult }

/**
 * The strike on screen: shown as soon as it is measured (ladder first, charts a
 * frame later so they never delay it), or opened from the server with its audio.
 */
export function useBenchResult(latestStrikeId: () => string | undefined) {
  const bench = useBenchStore()
  const api = useApiFetch()
  /** The strike whose charts may be drawn; lags the ladder by a frame. */
  const chartsFor = ref<string | null>(null)
  const chartsReady = computed(() => Boolean(bench.shown && chartsFor.value === bench.shown.id))

  async function showStrike(strike: StrikeOnScreen, audio: StrikeAudio | null) {
    bench.show({ ...strike, audio })
    chartsFor.value = null
    await nextTick()
    // The ladder is painted in the next frame; the charts follow it so they never delay it.
    requestAnimationFrame(() => {
      performance.mark('tw:ladder-drawn')
      setTimeout(() => (chartsFor.value = strike.id), 0)
    })
  }

  /** A stored strike, its analysis at once and its audio (for the charts) when it has arrived. */
  async function openStrike(id: string) {
    try {
      const strike = await api<StrikeOnScreen>(`/api/strikes/${id}`)
      bench.show({ ...strike, audio: null })
      chartsFor.value = strike.id
      const bytes = await api<ArrayBuffer>(`/api/strikes/${id}/audio`, { responseType: 'arrayBuffer' })
      const samples = await decodeForDisplay(bytes, strike.analysis.sampleRate)
      if (bench.shown?.id === id) bench.show({ ...strike, audio: { samples, sampleRate: strike.analysis.sampleRate } })
    }
    catch (error) {
      bench.problem = apiErrorMessage(error)
    }
  }

  // Opening the Bench on a piece with strikes shows its latest one, audio from the server.
  watch(latestStrikeId, (id) => {
    if (id && import.meta.client && !bench.shown) void openStrike(id)
  }, { immediate: true })

  return { chartsReady, showStrike, openStrike }
}
