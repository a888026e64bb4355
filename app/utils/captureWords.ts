import type { CaptureState } from '~/stores/bench'

/** What the microphone is doing, in the Bench's words (the capture card and the bar). */
export const CAPTURE_WORDS: Record<CaptureState, string> = {
  off: 'Microphone off',
  listening: 'Listening, not armed',
  armed: 'Armed: strike the piece',
  recording: 'Recording…',
  uploading: 'Measuring…',
}
