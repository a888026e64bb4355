// The capture worklet (public/worklets/tw-capture.js) is served from the app's own
// origin, which the Content-Security-Policy allows for scripts and worklets.
const WORKLET_URL = '/worklets/tw-capture.js'

/** Level of the last block for the meter, in dB re full scale. */
export interface InputLevel { peakDb: number, rmsDb: number, clipped: boolean }

/** A sample at or beyond this magnitude counts as clipped (one 16-bit code below full scale). */
const CLIP = 32767 / 32768

/**
 * The bench microphone: raw PCM at the device's rate through an AudioWorklet, with
 * the browser's echo cancellation, noise suppression and automatic gain turned off
 * (they would change the partials' levels and decay).
 */
export function useMicrophone() {
  const active = ref(false)
  const sampleRate = ref(0)
  const level = ref<InputLevel>({ peakDb: -120, rmsDb: -120, clipped: false })
  const clipHold = ref(false)
  const deviceLabel = ref('')
  let context: AudioContext | null = null
  let stream: MediaStream | null = null
  let node: AudioWorkletNode | null = null
  let clipTimer: ReturnType<typeof setTimeout> | undefined
  const listeners = new Set<(block: Float32Array) => void>()

  async function start() {
    if (active.value) return
    stream = await navigator.mediaDevices.getUserMedia({
      audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false, channelCount: 1 },
      video: false,
    })
    const track = stream.getAudioTracks()[0]
    const settings = track?.getSettings() ?? {}
    deviceLabel.value = track?.label ?? ''
    // Run the graph at the microphone's own rate, so no resampling sits between it and the file.
    try {
      // 'playback': larger render buffers, more headroom against an underrun (nothing is monitored live).
      context = new AudioContext({ latencyHint: 'playback', ...(settings.sampleRate ? { sampleRate: settings.sampleRate } : {}) })
    }
    catch {
      context = new AudioContext()
    }
    await context.audioWorklet.addModule(WORKLET_URL)
    node = new AudioWorkletNode(context, 'tw-capture', { numberOfInputs: 1, numberOfOutputs: 1, channelCount: 1, channelCountMode: 'explicit' })
    node.port.onmessage = (e: MessageEvent<Float32Array>) => onBlock(e.data)
    const source = context.createMediaStreamSource(stream)
    // A silent sink keeps the worklet pulled by the graph.
    const sink = context.createGain()
    sink.gain.value = 0
    source.connect(node).connect(sink).connect(context.destination)
    await context.resume()
    sampleRate.value = context.sampleRate
    active.value = true
  }

  function onBlock(block: Float32Array) {
    let peak = 0
    let sum = 0
    for (let i = 0; i < block.length; i++) {
      const a = Math.abs(block[i]!)
      if (a > peak) peak = a
      sum += block[i]! * block[i]!
    }
    const clipped = peak >= CLIP
    level.value = { peakDb: 20 * Math.log10(Math.max(peak, 1e-6)), rmsDb: 10 * Math.log10(Math.max(sum / block.length, 1e-12)), clipped }
    if (clipped) {
      clipHold.value = true
      clearTimeout(clipTimer)
      clipTimer = setTimeout(() => (clipHold.value = false), 2000)
    }
    for (const listener of listeners) listener(block)
  }

  function onSamples(listener: (block: Float32Array) => void) {
    listeners.add(listener)
    return () => listeners.delete(listener)
  }

  async function stop() {
    node?.disconnect()
    for (const t of stream?.getTracks() ?? []) t.stop()
    await context?.close().catch(() => {})
    node = null
    stream = null
    context = null
    active.value = false
  }

  onBeforeUnmount(() => {
    clearTimeout(clipTimer)
    void stop()
  })

  return { active, sampleRate, level, clipHold, deviceLabel, start, stop, onSamples }
}
