import { defineStore } from 'pinia'
import { computed, ref } from 'vue'

/** The supervisor's place in the review queue: which piece is open, kept by id so a refresh does not jump. */
export const useReviewCursorStore = defineStore('reviewCursor', () => {
  const ids = ref<string[]>([])
  const currentId = ref<string | null>(null)
  const index = computed(() => Math.max(0, currentId.value ? ids.value.indexOf(currentId.value) : 0))

  /** Takes a fresh queue; keeps the open piece, or the one now at its place when it left the queue. */
  function load(next: string[]) {
    const old = index.value
    ids.value = next
    if (!currentId.value || !next.includes(currentId.value)) currentId.value = next[Math.min(old, next.length - 1)] ?? null
  }
  function move(step: number) {
    if (ids.value.length === 0) return
    const i = Math.min(ids.value.length - 1, Math.max(0, index.value + step))
    currentId.value = ids.value[i]!
  }
  function select(id: string) {
    if (ids.value.includes(id)) currentId.value = id
  }
  return { ids, currentId, index, load, move, select }
})
