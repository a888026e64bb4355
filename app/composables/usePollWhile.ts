import { onBeforeUnmount, onMounted, watch } from 'vue'

/**
 * Calls `refresh` every `everyMs` while `active()` holds and the tab is visible; stops when the
 * work has settled or the tab is hidden, and catches up at once when the tab shows again.
 */
export function usePollWhile(active: () => boolean, refresh: () => unknown, everyMs = 3000) {
  let timer: ReturnType<typeof setTimeout> | undefined
  const visible = () => typeof document === 'undefined' || document.visibilityState === 'visible'
  function schedule() {
    clearTimeout(timer)
    timer = undefined
    if (import.meta.client && active() && visible()) timer = setTimeout(tick, everyMs)
  }
  async function tick() {
    timer = undefined
    if (!active() || !visible()) return
    await refresh()
    schedule()
  }
  function onVisibility() {
    if (visible() && active()) void tick()
    else schedule()
  }
  watch(active, schedule)
  onMounted(() => {
    document.addEventListener('visibilitychange', onVisibility)
    schedule()
  })
  onBeforeUnmount(() => {
    clearTimeout(timer)
    document.removeEventListener('visibilitychange', onVisibility)
  })
  return { isPolling: () => timer !== undefined }
}
