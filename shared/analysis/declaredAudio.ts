/**
 * What a container's header says about the audio inside, read before decoding so that
 * limits cost nothing. `frames` is the stated length in frames at `sampleRate` (null when
 * the header does not state it); `minDurationS` is a length the audio cannot be shorter
 * than (for formats that only bound it, such as MP3 without a frame count).
 */
export interface DeclaredAudio {
  codec: 'wav' | 'flac' | 'aiff' | 'mp3' | 'vorbis' | 'opus'
  channels: number | null
  sampleRate: number | null
  frames: number | null
  minDurationS: number | null
}
