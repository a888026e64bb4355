import { shallowRef } from 'vue'

/** What a destructive or final action asks before it runs. */
export interface ConfirmRequest {
  title: string
  /** What will happen, in a sentence or two. */
  body?: string
  /** The confirming button's words ("Scrap piece", "Mark shipped"). */
  action: string
  danger?: boolean
  /** Ask for a reason (kept in the audit trail) of at least `minLength` characters. */
  reason?: { label: string, minLength: number }
}

export interface ConfirmAsked extends ConfirmRequest { resolve: (answer: { reason: string } | null) => void }

// One question at a time for the whole app, answered by the one ConfirmDialog in the layout.
// Only clicks ask, so this lives in the browser alone and is never shared between server requests.
const asked = shallowRef<ConfirmAsked | null>(null)

/** Ask before a destructive or final action: `null` when the member cancels, else the reason given. */
export function useConfirm() {
  function ask(request: ConfirmRequest): Promise<{ reason: string } | null> {
    asked.value?.resolve(null)
    return new Promise((resolve) => {
      asked.value = { ...request, resolve }
    })
  }
  function answer(reply: { reason: string } | null) {
    const current = asked.value
    asked.value = null
    current?.resolve(reply)
  }
  return { asked, ask, answer }
}
