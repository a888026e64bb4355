/** Settings of the automatic strike capture. */
export interface TriggerSettings {
  sampleRate: number
  /** Audio kept from before the level crossed the threshold, in s. */
  preRollS: number
  /** The longest recording, in s. */
  maxS: number
  /** The shortest recording before the end on the noise floor is looked for, in s. */
  minS: number
  /** The strike starts when the block peak rises this far above the noise floor, in dB… */
  riseDb: number
  /** …and at least to this level, in dB re full scale. */
  floorThresholdDb: number
  /** The recording ends when the level falls within this many dB of the noise floor. */
  endMarginDb: number
  /** Quiet needed after arming before a strike counts, in s (a piece still ringing is not a new strike). */
  quietS: number
}

export const TRIGGER_DEFAULTS: Omit<TriggerSettings, 'sampleRate'> = {
  preRollS: 0.1,
  maxS: 3,
  minS: 0.4,
  riseDb: 24,
  floorThresholdDb: -50,
  endMarginDb: 6,
  quietS: 0.2,
}

export type TriggerState = 'waiting' | 'recording' | 'done'

/** Exact zeros in a row that count as a dropout, and the level (−60 dBFS) the sound must have had just before. */
const DROPOUT_SAMPLES = 32
const DROPOUT_LEVEL = 0.001

const toDb = (x: number) => 20 * Math.log10(Math.max(x, 1e-10))

/**
 * Automatic strike capture over a stream of sample blocks: waits for the level to
 * rise well above the noise floor, keeps a pre-roll, records until the sound sinks
 * back into the noise floor or the maximum length is reached. Pure and synchronous,
 * so it runs the same in the browser's audio callback and in a unit test.
 */
export class StrikeTrigger {
  readonly settings: TriggerSettings
  state: TriggerState = 'waiting'
  /** Noise floor (RMS of quiet blocks) in dB re full scale, tracked while waiting. */
  noiseFloorDb = -90
  private ring: Float32Array
  private ringWrite = 0
  private ringFilled = 0
  private chunks: Float32Array[] = []
  private recorded = 0
  private quietSamples = 0
  private floorSeen = false
  private tailRms: number[] = []
  /** Started by hand: then only a stop or the maximum length ends it. */
  private manual = false
  /**
   * Gaps of digital silence inside the ringing sound: the audio path lost input (an
   * underrun while the computer was busy). A microphone never gives a run of exact
   * zeros while something rings, and such a gap shifts the measured pitch.
   */
  dropouts = 0
  private zeroRun = 0
  private recentPeak = 0

  constructor(settings: Partial<TriggerSettings> & { sampleRate: number }) {
    this.settings = { ...TRIGGER_DEFAULTS, ...settings }
    this.ring = new Float32Array(Math.max(1, Math.round(this.settings.preRollS * this.settings.sampleRate)))
  }

  get thresholdDb(): number {
    return Math.max(this.settings.floorThresholdDb, this.noiseFloorDb + this.settings.riseDb)
  }

  /** Recorded length so far, in s. */
  get recordedS(): number {
    return this.recorded / this.settings.sampleRate
  }

  /** Starts recording now, without waiting for the threshold (manual start). */
  start(): void {
    if (this.state !== 'waiting') return
    this.manual = true
    this.beginRecording()
  }

  /** Ends the recording now (manual stop). */
  stop(): void {
    if (this.state === 'recording') this.state = 'done'
  }

  /** Feeds one block of samples; returns the state after it. */
  push(block: Float32Array): TriggerState {
    if (this.state === 'done') return this.state
    let peak = 0
    let sum = 0
    for (let i = 0; i < block.length; i++) {
      const v = block[i]!
      const a = v < 0 ? -v : v
      if (a > peak) peak = a
      sum += v * v
    }
    const rmsDb = toDb(Math.sqrt(sum / Math.max(1, block.length)))
    if (this.state === 'waiting') {
      if (toDb(peak) >= this.thresholdDb && this.quietSamples >= this.settings.quietS * this.settings.sampleRate) {
        this.beginRecording()
        this.append(block)
      }
      else {
        if (toDb(peak) < this.thresholdDb) this.quietSamples += block.length
        else this.quietSamples = 0
        this.trackFloor(rmsDb)
        this.keep(block)
      }
      return this.state
    }
    this.append(block)
    this.scanDropouts(block)
    this.tailRms.push(rmsDb)
    const tailBlocks = Math.max(1, Math.round((0.1 * this.settings.sampleRate) / Math.max(1, block.length)))
    if (this.tailRms.length > tailBlocks) this.tailRms.shift()
    const tailDb = Math.max(...this.tailRms)
    if (this.recordedS >= this.settings.maxS) this.state = 'done'
    else if (!this.manual && this.recordedS >= this.settings.minS && this.floorSeen && tailDb <= this.noiseFloorDb + this.settings.endMarginDb) this.state = 'done'
    return this.state
  }

  /** The recording (pre-roll included), trimmed to the maximum length. */
  take(): Float32Array {
    const maxSamples = Math.round(this.settings.maxS * this.settings.sampleRate)
    const out = new Float32Array(Math.min(this.recorded, maxSamples))
    let offset = 0
    for (const c of this.chunks) {
      if (offset >= out.length) break
      const part = c.subarray(0, Math.min(c.length, out.length - offset))
      out.set(part, offset)
      offset += part.length
    }
    return out
  }

  private scanDropouts(block: Float32Array) {
    for (let i = 0; i < block.length; i++) {
      const v = block[i]!
      if (v === 0) {
        if (++this.zeroRun === DROPOUT_SAMPLES && this.recentPeak > DROPOUT_LEVEL) this.dropouts++
      }
      else {
        this.zeroRun = 0
        // Peak of the last stretch of sound, decaying so a gap long after the ring ended is not counted.
        const a = v < 0 ? -v : v
        this.recentPeak = Math.max(a, this.recentPeak * 0.9995)
      }
    }
  }

  private trackFloor(rmsDb: number) {
    // Falls at once to a quieter block, rises slowly (about 3 dB/s at 48 kHz blocks of 2048),
    // so a passing noise does not lift the threshold and a quieter room lowers it.
    if (!this.floorSeen) {
      this.noiseFloorDb = rmsDb
      this.floorSeen = true
    }
    else if (rmsDb < this.noiseFloorDb) this.noiseFloorDb = rmsDb
    else this.noiseFloorDb += Math.min(rmsDb - this.noiseFloorDb, 0.12)
  }

  private keep(block: Float32Array) {
    const ring = this.ring
    for (let i = 0; i < block.length; i++) {
      ring[this.ringWrite] = block[i]!
      this.ringWrite = (this.ringWrite + 1) % ring.length
    }
    this.ringFilled = Math.min(ring.length, this.ringFilled + block.length)
  }

  private beginRecording() {
    const ring = this.ring
    const pre = new Float32Array(this.ringFilled)
    const start = (this.ringWrite - this.ringFilled + ring.length) % ring.length
    for (let i = 0; i < this.ringFilled; i++) pre[i] = ring[(start + i) % ring.length]!
    this.state = 'recording'
    this.chunks = []
    this.recorded = 0
    this.append(pre)
  }

  private append(block: Float32Array) {
    if (block.length === 0) return
    this.chunks.push(block.slice())
    this.recorded += block.length
  }
}
