/**
 * Whether the page has started in the browser (mounted after hydration). A submit button drawn
 * by the server waits for it: a form sent before then would reach the server as a plain post and
 * lose what was typed.
 */
export function useStarted() {
  const started = ref(false)
  onMounted(() => {
    started.value = true
  })
  return started
}
