/** How far from the top of the window the result is brought, in px. */
const MARGIN_PX = 12

/**
 * Brings the Bench's result (ladder, verdict, guidance) into view after a strike, on
 * any layout, without a hand on the screen: only when its top is not already in the
 * upper part of the window, smoothly unless the user asked for reduced motion.
 */
export function useResultIntoView() {
  const target = ref<HTMLElement | null>(null)

  function bringIntoView() {
    const el = target.value
    if (!el || typeof window === 'undefined') return
    const top = el.getBoundingClientRect().top
    // Already where the eye is: leave the page alone (a wide screen shows it from the start).
    if (top >= 0 && top <= window.innerHeight * 0.3) return
    const reduce = window.matchMedia('(prefers-reduced-motion: reduce)').matches
    window.scrollBy({ top: top - MARGIN_PX, behavior: reduce ? 'auto' : 'smooth' })
  }

  return { target, bringIntoView }
}
