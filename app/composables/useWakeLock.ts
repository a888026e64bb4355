/**
 * Keeps the screen awake while the component that calls it is mounted (the Bench:
 * one hand holds a mallet). Uses the Screen Wake Lock API where the browser has it;
 * the browser drops the lock when the page is hidden, so it is asked for again when
 * the page shows. Elsewhere, or when refused (a battery saver), the screen may sleep.
 */
export function useWakeLock() {
  const held = ref(false)
  let sentinel: WakeLockSentinel | null = null
  let wanted = false

  async function request() {
    if (!wanted || sentinel || typeof navigator === 'undefined' || !('wakeLock' in navigator)) return
    if (document.visibilityState !== 'visible') return
    try {
      const lock = await navigator.wakeLock.request('screen')
      if (!wanted) {
        void lock.release()
        return
      }
      sentinel = lock
      held.value = true
      lock.addEventListener('release', () => {
        if (sentinel === lock) sentinel = null
        held.value = false
      })
    }
    catch {
      held.value = false
    }
  }

  function onVisibility() {
    if (document.visibilityState === 'visible') void request()
  }

  onMounted(() => {
    wanted = true
    document.addEventListener('visibilitychange', onVisibility)
    void request()
  })
  onBeforeUnmount(() => {
    wanted = false
    document.removeEventListener('visibilitychange', onVisibility)
    const lock = sentinel
    sentinel = null
    held.value = false
    void lock?.release().catch(() => {})
  })

  return { held }
}
