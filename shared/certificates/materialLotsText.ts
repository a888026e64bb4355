import type { CertificateContent } from './content'

/** The certificate's "Material lots" line: each lot's code, material and species, and the permit number of a listed species. */
export function materialLotsText(lots: CertificateContent['instrument']['lots']): string {
  if (!lots.length) return 'none recorded'
  return lots.map((l) => {
    const what = [l.material, l.species].filter(Boolean).join(', ')
    return `${l.code} (${what}${l.permitNumber ? `; permit ${l.permitNumber}` : ''})`
  }).join('; ')
}
