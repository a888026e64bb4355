/** A record page's edit form, open or closed: a save closes it and reads the record again. */
export function useEditing(refresh: () => Promise<unknown>) {
  const editing = ref(false)
  async function saved() {
    editing.value = false
    await refresh()
  }
  return { editing, saved }
}
