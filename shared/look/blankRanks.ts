import type { BlankRank } from '../barModel/gradeFromThresholds'

/**
 * How a blank's rank is drawn: in ink (a rank is no tuning verdict, so it takes no verdict
 * colour), told apart by its shape and always written out.
 */
export const BLANK_RANK_LOOKS: Record<BlankRank, { shape: 'diamond' | 'open-diamond' | 'crossed-diamond', word: string, says: string }> = {
  select: { shape: 'diamond', word: 'select', says: 'stiff and ringing: good for the longest, lowest bars' },
  usable: { shape: 'open-diamond', word: 'usable', says: 'fit for bars, below the select figures' },
  reject: { shape: 'crossed-diamond', word: 'reject', says: 'below the usable figures' },
}
