import { keyActionFor, type PageKeyAction } from '#shared/keys'

type ReviewKeyAction = Exclude<PageKeyAction<'review'>, 'showKeys' | 'leaveField'>

/**
 * The review desk's keys, from the one key map (shared/keys.ts): none act while a text field
 * has the focus, and Escape leaves the field. `?` belongs to KeysPanel.
 */
export function useReviewKeys(act: Record<ReviewKeyAction, () => void>) {
  function onKey(event: KeyboardEvent) {
    const action = keyActionFor('review', event, event.target as HTMLElement | null)
    if (!action || action === 'showKeys') return
    if (action === 'leaveField') {
      if (event.target instanceof HTMLElement && event.target !== document.body) event.target.blur()
      return
    }
    event.preventDefault()
    act[action]()
  }
  onMounted(() => window.addEventListener('keydown', onKey))
  onBeforeUnmount(() => window.removeEventListener('keydown', onKey))
}
