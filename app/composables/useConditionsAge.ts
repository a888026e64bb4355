import { conditionsAge } from '#shared/bench/conditionsAge'
import { useBenchStore } from '~/stores/bench'

/**
 * How old the bench conditions are, kept current by a half-minute clock; `timeZone` is
 * the workshop's when known, the browser's otherwise.
 */
export function useConditionsAge(timeZone?: () => string | undefined) {
  const bench = useBenchStore()
  const now = ref(Date.now())
  let tick: ReturnType<typeof setInterval> | undefined
  onMounted(() => {
    now.value = Date.now()
    tick = setInterval(() => (now.value = Date.now()), 30_000)
  })
  onBeforeUnmount(() => clearInterval(tick))
  const age = computed(() => conditionsAge(bench.conditionsEnteredAt, now.value, { timeZone: timeZone?.() }))
  const entered = computed(() => bench.temperatureC !== null || bench.humidityPct !== null)
  /** Conditions were typed once and should be checked again now. */
  const stale = computed(() => entered.value && age.value.stale)
  function confirm() {
    bench.confirmConditions()
    now.value = Date.now()
  }
  return { age, entered, stale, confirm }
}
