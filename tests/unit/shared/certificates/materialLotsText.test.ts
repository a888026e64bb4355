import { describe, expect, it } from 'vitest'
import { materialLotsText } from '../../../../shared/certificates/materialLotsText'

describe('materialLotsText', () => {
  it('writes each lot with its material and species, and the permit of a listed one', () => {
    expect(materialLotsText([
      { code: 'RW-2611', material: 'rosewood', species: 'Dalbergia stevensonii', permitNumber: 'EX-26-0917' },
      { code: 'ST-0409', material: 'steel', species: '', permitNumber: '' },
    ])).toBe('RW-2611 (rosewood, Dalbergia stevensonii; permit EX-26-0917); ST-0409 (steel)')
  })

  it('says so when no lot was recorded', () => {
    expect(materialLotsText([])).toBe('none recorded')
  })
})
