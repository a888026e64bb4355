export type BenchKeyAction = 'strike' | 'next' | 'review'

interface KeyTarget { tagName: string, isContentEditable: boolean }

/**
 * What a key press on the Bench asks for, or null: space strikes, n opens the next
 * piece, r sends to review. Not with a modifier, not while typing in a field; a
 * focused button or link keeps its own space-bar press.
 */
export function benchKeyAction(e: { key: string, ctrlKey: boolean, metaKey: boolean, altKey: boolean }, target: KeyTarget | null): BenchKeyAction | null {
  if (e.ctrlKey || e.metaKey || e.altKey) return null
  if (target && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName))) return null
  if (e.key === ' ') return target && ['BUTTON', 'A', 'SUMMARY'].includes(target.tagName) ? null : 'strike'
  if (e.key === 'n') return 'next'
  if (e.key === 'r') return 'review'
  return null
}

/** The Bench's keys, while a piece is chosen; the space bar's page scroll is kept from happening. */
export function useBenchKeys(active: () => boolean, act: Record<BenchKeyAction, () => void>) {
  function onKey(e: KeyboardEvent) {
    if (!active()) return
    const action = benchKeyAction(e, e.target as HTMLElement | null)
    if (!action) return
    if (action === 'strike') e.preventDefault()
    act[action]()
  }
  onMounted(() => window.addEventListener('keydown', onKey))
  onBeforeUnmount(() => window.removeEventListener('keydown', onKey))
}
