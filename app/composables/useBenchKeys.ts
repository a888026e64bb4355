import { keyActionFor } from '#shared/keys'

export type BenchKeyAction = 'strike' | 'next' | 'review'

interface KeyTarget { tagName: string, isContentEditable: boolean }

// The Bench's names for the shared key map's actions (shared/keys.ts).
const BENCH_ACTIONS = { arm: 'strike', nextPiece: 'next', sendToReview: 'review' } as const

/**
 * What a key press on the Bench asks for, or null, from the shared key map: space strikes,
 * n opens the next piece, r sends to review. A focused button or link keeps its own
 * space-bar press.
 */
export function benchKeyAction(e: { key: string, ctrlKey: boolean, metaKey: boolean, altKey: boolean }, target: KeyTarget | null): BenchKeyAction | null {
  const action = keyActionFor('bench', e, target)
  if (!action || !(action in BENCH_ACTIONS)) return null
  if (action === 'arm' && target && ['BUTTON', 'A', 'SUMMARY'].includes(target.tagName)) return null
  return BENCH_ACTIONS[action as keyof typeof BENCH_ACTIONS]
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
