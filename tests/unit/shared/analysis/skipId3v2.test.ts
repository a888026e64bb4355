import { describe, expect, it } from 'vitest'
import { skipId3v2 } from '../../../../shared/analysis/skipId3v2'

describe('skipId3v2', () => {
  it('reads the synchsafe size: 0x00 0x00 0x02 0x01 is 257 bytes after the 10-byte header', () => {
    // source: ID3v2.4 structure §3.1, sizes are 28-bit "synchsafe" integers.
    const tag = new Uint8Array(400)
    tag.set([0x49, 0x44, 0x33, 4, 0, 0, 0, 0, 0x02, 0x01])
    expect(skipId3v2(tag)).toBe(267)
    tag[5] = 0x10 // footer present
    expect(skipId3v2(tag)).toBe(277)
  })

  it('is 0 without a tag and never points past the end', () => {
    expect(skipId3v2(new Uint8Array([0xff, 0xfb, 0x90, 0x40]))).toBe(0)
    expect(skipId3v2(new Uint8Array([0x49, 0x44, 0x33, 4, 0, 0, 0x7f, 0x7f, 0x7f, 0x7f]))).toBe(10)
  })
})
