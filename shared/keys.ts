/**
 * Every keyboard key of the app, in one place: one key, one meaning, on every page.
 * A page lists the actions it offers; `?` shows that list (KeyMapPanel).
 */
export const KEY_ACTIONS = {
  arm: { keys: [' '], shown: ['space'], meaning: 'Arm the microphone for the next strike' },
  nextPiece: { keys: ['n'], shown: ['n'], meaning: 'Open the next piece of the set' },
  sendToReview: { keys: ['r'], shown: ['r'], meaning: 'Send the piece to review' },
  queueNext: { keys: ['j', 'ArrowDown'], shown: ['j', '↓'], meaning: 'Next piece in the queue' },
  queuePrevious: { keys: ['k', 'ArrowUp'], shown: ['k', '↑'], meaning: 'Previous piece in the queue' },
  approve: { keys: ['a'], shown: ['a'], meaning: 'Approve the open piece' },
  returnForRework: { keys: ['x'], shown: ['x'], meaning: 'Return the open piece for rework (asks for a reason)' },
  undoApproval: { keys: ['u'], shown: ['u'], meaning: 'Undo the last approval while it can still be undone' },
  playStrike: { keys: ['p'], shown: ['p'], meaning: 'Play the open piece’s latest strike' },
  showKeys: { keys: ['?'], shown: ['?'], meaning: 'Show or hide this list of keys' },
  leaveField: { keys: ['Escape'], shown: ['Esc'], meaning: 'Leave a text field, so the keys work again' },
} as const satisfies Record<string, { keys: readonly string[], shown: readonly string[], meaning: string }>

export type KeyAction = keyof typeof KEY_ACTIONS

/** The actions each page with keys offers, in the order its `?` panel lists them. */
export const PAGE_KEYS = {
  bench: ['arm', 'nextPiece', 'sendToReview', 'showKeys', 'leaveField'],
  review: ['queueNext', 'queuePrevious', 'approve', 'returnForRework', 'undoApproval', 'playStrike', 'showKeys', 'leaveField'],
} as const satisfies Record<string, readonly KeyAction[]>

export type KeyPage = keyof typeof PAGE_KEYS
export type PageKeyAction<P extends KeyPage> = (typeof PAGE_KEYS)[P][number]

interface KeyPress { key: string, ctrlKey: boolean, metaKey: boolean, altKey: boolean }
interface KeyTarget { tagName: string, isContentEditable: boolean }

/** True while a text field has the focus: typing there never triggers a key. */
export function isTypingTarget(target: KeyTarget | null): boolean {
  return !!target && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName))
}

/**
 * What a key press asks for on this page, or null: not with Ctrl, Cmd or Alt (left to the
 * browser), not while typing in a field (Escape excepted, which leaves the field).
 */
export function keyActionFor<P extends KeyPage>(page: P, press: KeyPress, target: KeyTarget | null): PageKeyAction<P> | null {
  if (press.ctrlKey || press.metaKey || press.altKey) return null
  const typing = isTypingTarget(target)
  for (const action of PAGE_KEYS[page] as readonly PageKeyAction<P>[]) {
    if (!(KEY_ACTIONS[action].keys as readonly string[]).includes(press.key)) continue
    if (typing && action !== 'leaveField') return null
    return action
  }
  return null
}
