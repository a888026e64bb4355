import { encodeWav } from '#shared/analysis/encodeWav'
import { isStrikeable } from '#shared/records/stages'
import type { RecordedStrike } from '~/composables/useStrikeUpload'
import { useBenchStore, type StrikeAudio } from '~/stores/bench'
import type { BenchPiece } from '~/composables/useBenchPiece'

export interface BenchCaptureDeps {
  pieceId: Ref<string | null>
  piece: Ref<BenchPiece | null | undefined>
  showStrike: (strike: RecordedStrike, audio: StrikeAudio | null) => Promise<void>
  refreshPiece: () => Promise<unknown>
  refreshSet: () => Promise<unknown>
}

/** The file name a microphone recording is uploaded under. */
export function recordingFileName(note: string | undefined) {
  return `strike-${note ?? 'piece'}.wav`
}

/**
 * Capture on the Bench: the armed microphone records a strike, which is encoded,
 * uploaded with the bench conditions and shown; a dropped recording of this piece
 * is shown the same way.
 */
export function useBenchCapture({ pieceId, piece, showStrike, refreshPiece, refreshSet }: BenchCaptureDeps) {
  const bench = useBenchStore()
  const upload = useStrikeUpload()

  async function onRecorded(samples: Float32Array, sampleRate: number) {
    if (!pieceId.value) return
    bench.capture = 'uploading'
    bench.problem = null
    bench.uploadProgress = 0
    let measured = false
    try {
      const wav = encodeWav(samples, sampleRate)
      const strike = await upload(pieceId.value, new Blob([wav as BlobPart], { type: 'audio/wav' }), recordingFileName(piece.value?.note), bench.conditions, f => (bench.uploadProgress = f))
      performance.mark('tw:strike-measured')
      await showStrike(strike, { samples, sampleRate })
      measured = true
      void refreshPiece()
    }
    catch (error) {
      bench.problem = (error as Error).message
    }
    finally {
      bench.uploadProgress = null
      bench.capture = 'listening'
    }
    // Stay armed: the next strike starts the next take while this result stays on screen.
    // Not after a refusal, which would only be refused again.
    if (measured && bench.stayArmed && strikeable.value) void capture.arm()
  }

  const capture = useStrikeCapture(onRecorded, () => piece.value?.set.referenceHz ?? 440)

  async function onUploaded(strike: RecordedStrike, file: File) {
    if (strike.pieceId === pieceId.value) {
      const bytes = await file.arrayBuffer()
      const samples = await decodeForDisplay(bytes, strike.analysis.sampleRate).catch(() => null)
      await showStrike(strike, samples ? { samples, sampleRate: strike.analysis.sampleRate } : null)
      void refreshPiece()
    }
    void refreshSet()
  }

  const strikeable = computed(() => Boolean(piece.value && isStrikeable(piece.value.stage)))
  // Sent to review (or moved on) while armed: a piece that takes no strikes is not listened for.
  watch(strikeable, (ok) => {
    if (!ok) capture.disarm()
  })

  return { capture, onUploaded, strikeable }
}
