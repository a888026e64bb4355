import { describe, expect, it } from 'vitest'
import { listedTimberFor, permitProblem } from '../../../../shared/records/listedTimber'
import { LotInputSchema, LotPatchSchema } from '../../../../shared/schemas/records'

describe('listedTimberFor', () => {
  it('covers every species of a listed genus, whatever the case or trailing words', () => {
    // from memory: CITES Appendix II lists Dalbergia spp.; Honduran rosewood is Dalbergia stevensonii
    expect(listedTimberFor('Dalbergia stevensonii')?.name).toBe('Dalbergia')
    // from memory: Brazilian rosewood, D. nigra, is in Appendix I
    expect(listedTimberFor('dalbergia nigra')?.name).toBe('Dalbergia')
    expect(listedTimberFor('Dalbergia (billet batch)')?.name).toBe('Dalbergia')
    // from memory: lignum vitae, Guaiacum spp., Appendix II
    expect(listedTimberFor('Guaiacum officinale')?.name).toBe('Guaiacum')
  })

  it('names only the listed species of a genus that is not listed as a whole', () => {
    // from memory: P. erinaceus (kosso) is in Appendix II, African padauk (P. soyauxii) is not
    expect(listedTimberFor('Pterocarpus erinaceus')?.name).toBe('Pterocarpus erinaceus')
    expect(listedTimberFor('Pterocarpus soyauxii')).toBeNull()
    expect(listedTimberFor('Pterocarpus')).toBeNull()
  })

  it('does not match a word that only starts like a listed genus, nor metals', () => {
    expect(listedTimberFor('Dalbergiana')).toBeNull()
    expect(listedTimberFor('spring steel, hardened')).toBeNull()
    expect(listedTimberFor('')).toBeNull()
  })
})

describe('permitProblem and the lot schemas', () => {
  it('asks for the permit of a listed species and nothing of others', () => {
    expect(permitProblem('Dalbergia retusa', '')).toMatch(/Dalbergia is a listed species \(CITES Appendix II.*permit/)
    expect(permitProblem('Dalbergia retusa', '  ')).not.toBeNull()
    expect(permitProblem('Dalbergia retusa', 'EX-1')).toBeNull()
    expect(permitProblem('Acer saccharum', '')).toBeNull()
  })

  it('puts the sentence on the permit field, and reads empty form fields as not recorded', () => {
    const refused = LotInputSchema.safeParse({ code: 'RW-1', material: 'rosewood', species: 'Dalbergia cearensis' })
    expect(refused.success).toBe(false)
    expect(refused.error?.issues[0]?.path).toEqual(['permitNumber'])
    const parsed = LotInputSchema.parse({ code: 'AL-1', material: 'aluminium', species: '6061-T6', receivedOn: '', moisturePct: '' })
    expect(parsed).toMatchObject({ receivedOn: null, moisturePct: null, permitNumber: '' })
  })

  it('an edit names only what it changes and must change something', () => {
    expect(LotPatchSchema.parse({ supplier: 'Someone' })).toEqual({ supplier: 'Someone' })
    expect(LotPatchSchema.safeParse({}).success).toBe(false)
  })
})
