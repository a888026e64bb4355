// The Bench's capture worklet (app/composables/useMicrophone.ts): copies the first
// input channel into blocks of 2048 frames and posts them to the page, transferring
// the buffer.
class TwCapture extends AudioWorkletProcessor {
  constructor() { super(); this.block = new Float32Array(2048); this.fill = 0 }
  process(inputs) {
    const ch = inputs[0] && inputs[0][0]
    if (!ch) return true
    let i = 0
    while (i < ch.length) {
      const n = Math.min(ch.length - i, this.block.length - this.fill)
      this.block.set(ch.subarray(i, i + n), this.fill)
      this.fill += n; i += n
      if (this.fill === this.block.length) {
        this.port.postMessage(this.block, [this.block.buffer])
        this.block = new Float32Array(2048); this.fill = 0
      }
    }
    return true
  }
}
registerProcessor('tw-capture', TwCapture)
