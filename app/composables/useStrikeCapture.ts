import { frequencyToNote } from '#shared/analysis/frequencyToNote'
import { roughPitch } from '#shared/bench/spectrum'
import { StrikeTrigger } from '#shared/bench/strikeTrigger'
import { useBenchStore } from '~/stores/bench'

const PITCH_SAMPLES = 16384

/**
 * Armed strike capture on the bench microphone: the trigger waits for a strike,
 * keeps a pre-roll, records until the noise floor or the maximum length, then hands
 * the recording over. A rough pitch of the live input is shown meanwhile (a guide:
 * the verdict comes from the server's analysis).
 */
export function useStrikeCapture(onRecorded: (samples: Float32Array, sampleRate: number) => void, referenceHz: () => number) {
  const bench = useBenchStore()
  const mic = useMicrophone()
  const micProblem = ref<string | null>(null)
  const rough = ref<{ frequencyHz: number, note: string, cents: number } | null>(null)
  const thresholdDb = ref<number | null>(null)
  const notice = ref<string | null>(null)
  let trigger: StrikeTrigger | null = null
  const recent = new Float32Array(PITCH_SAMPLES)
  let blocks = 0

  mic.onSamples((block) => {
    recent.copyWithin(0, block.length)
    recent.set(block, PITCH_SAMPLES - block.length)
    if (++blocks % 6 === 0) updatePitch()
    if (!trigger) return
    const state = trigger.push(block)
    thresholdDb.value = trigger.thresholdDb
    if (state === 'recording') {
      bench.capture = 'recording'
      bench.recordedS = trigger.recordedS
    }
    else if (state === 'done') finish()
  })

  function updatePitch() {
    // Only while something rings clearly above the floor; silence gives no pitch.
    if (mic.level.value.rmsDb < Math.max(-60, (trigger?.noiseFloorDb ?? -90) + 12)) return
    const p = roughPitch(recent, mic.sampleRate.value)
    if (!p) return
    const n = frequencyToNote(p.frequencyHz, referenceHz())
    rough.value = { frequencyHz: p.frequencyHz, note: n.note, cents: n.cents }
  }

  function finish() {
    if (!trigger) return
    const samples = trigger.take()
    const dropouts = trigger.dropouts
    trigger = null
    bench.capture = 'listening'
    if (dropouts > 0) {
      // A take with a gap would read off-pitch: not measured, armed again at once.
      performance.mark('tw:take-dropped')
      notice.value = 'The recording dropped out for a moment (the computer was busy), so it was not measured. Armed again: strike once more.'
      void arm()
      return
    }
    notice.value = null
    performance.mark('tw:strike-recorded', { detail: { seconds: samples.length / mic.sampleRate.value, sampleRate: mic.sampleRate.value } })
    onRecorded(samples, mic.sampleRate.value)
  }

  async function ensureMic() {
    micProblem.value = null
    try {
      await mic.start()
      if (bench.capture === 'off') bench.capture = 'listening'
      return true
    }
    catch (error) {
      const name = (error as { name?: string }).name
      micProblem.value = name === 'NotAllowedError'
        ? 'The browser was not allowed to use the microphone; allow it in the site settings and try again.'
        : name === 'NotFoundError'
          ? 'No microphone was found; plug one in, or drop recordings below instead.'
          : 'The microphone could not be opened; check that no other program holds it.'
      bench.capture = 'off'
      return false
    }
  }

  async function arm() {
    if (bench.capture === 'uploading' || bench.capture === 'recording') return
    if (!(await ensureMic())) return
    trigger = new StrikeTrigger({ sampleRate: mic.sampleRate.value, maxS: bench.maxS })
    bench.recordedS = 0
    bench.capture = 'armed'
  }

  function disarm() {
    trigger = null
    if (bench.capture === 'armed' || bench.capture === 'recording') bench.capture = 'listening'
  }

  async function startManual() {
    if (bench.capture !== 'armed') await arm()
    trigger?.start()
    if (trigger) bench.capture = 'recording'
  }

  function stopManual() {
    trigger?.stop()
    if (trigger?.state === 'done') finish()
  }

  return { mic, micProblem, notice, rough, thresholdDb, arm, disarm, startManual, stopManual }
}
