import type { CaptureState } from '~/stores/bench'

/** What the microphone is doing, in the Bench's words (the capture card and the bar). */
export const CAPTURE_WORDS: Record<CaptureState, string> = {
  off: 'Microphone off',
  listening: 'Listening, not armed',
  armed: 'Armed: strike the piece',
  recording: 'Recording…',
  uploading: 'Measuring…',
}

/** The bottom of the Bench's level scales, in dB re full scale. */
export const LEVEL_FLOOR_DB = -90

/** A level on the −90…0 dBFS scale as a CSS percentage. */
export function levelPercent(db: number) {
  return `${Math.max(0, Math.min(100, ((db - LEVEL_FLOOR_DB) / -LEVEL_FLOOR_DB) * 100))}%`
}
