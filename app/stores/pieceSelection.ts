import { defineStore } from 'pinia'
import { computed, ref } from 'vue'

/** Pieces ticked in the Pieces table, kept across pages and filter changes until cleared. */
export const usePieceSelectionStore = defineStore('pieceSelection', () => {
  const ids = ref<string[]>([])
  const count = computed(() => ids.value.length)
  const has = (id: string) => ids.value.includes(id)
  function toggle(id: string) {
    ids.value = has(id) ? ids.value.filter(x => x !== id) : [...ids.value, id]
  }
  function setMany(pageIds: string[], on: boolean) {
    ids.value = on ? [...new Set([...ids.value, ...pageIds])] : ids.value.filter(x => !pageIds.includes(x))
  }
  function clear() {
    ids.value = []
  }
  return { ids, count, has, toggle, setMany, clear }
})
