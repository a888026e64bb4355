import type { PartialAdvice } from './thinningAdvice'

/**
 * The Bench's advice words and mark, in one place. Advice is not a measurement: it
 * never uses the sharp/flat triangles or their colours.
 */
export const GUIDANCE_MARK = '⊖'

export const GUIDANCE_WORDS = {
  centre: 'remove material: centre',
  ends: 'remove material: ends',
  fromEachEnd: (percentIn: number) => `remove material: ${percentIn} % in from each end`,
  pitchDown: 'bring the pitch down',
  pitchUp: 'bring the pitch up',
} as const

/**
 * The short instruction for one piece of advice: on a bar, where to remove material
 * (the centre lowers the fundamental, the ends raise it); elsewhere only which way the
 * pitch must go, since where to work depends on the piece.
 */
export function guidanceWords(advice: Pick<PartialAdvice, 'move' | 'mode' | 'thinAt'>): string {
  if (advice.mode === null || advice.thinAt.length === 0) return advice.move === 'lower' ? GUIDANCE_WORDS.pitchDown : GUIDANCE_WORDS.pitchUp
  if (advice.move === 'raise') return GUIDANCE_WORDS.ends
  const zone = advice.thinAt[0]!
  if (zone.to >= 0.5) return GUIDANCE_WORDS.centre
  return GUIDANCE_WORDS.fromEachEnd(Math.round(((zone.from + zone.to) / 2) * 100))
}
