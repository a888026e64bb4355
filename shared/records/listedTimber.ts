/**
 * Timber species whose trade needs a permit or certificate, and the check a lot's
 * botanical name is held to. A genus entry covers every species of the genus.
 */
export interface ListedTimber { name: string, scope: 'genus' | 'species', listing: string }

// from memory: CITES Appendices I and II as they stand for tonewoods (Dalbergia spp. in Appendix II,
// D. nigra in Appendix I; Guaiacum spp., Swietenia spp., neotropical Cedrela spp. and the named
// Pterocarpus species in Appendix II). Check the current appendices before relying on this list.
export const LISTED_TIMBER: readonly ListedTimber[] = [
  { name: 'Dalbergia', scope: 'genus', listing: 'CITES Appendix II (Dalbergia spp.; D. nigra Appendix I)' },
  { name: 'Guaiacum', scope: 'genus', listing: 'CITES Appendix II (Guaiacum spp.)' },
  { name: 'Swietenia', scope: 'genus', listing: 'CITES Appendix II (Swietenia spp.)' },
  { name: 'Cedrela', scope: 'genus', listing: 'CITES Appendix II (Cedrela spp., neotropical populations)' },
  { name: 'Pterocarpus erinaceus', scope: 'species', listing: 'CITES Appendix II' },
  { name: 'Pterocarpus santalinus', scope: 'species', listing: 'CITES Appendix II' },
  { name: 'Pterocarpus tinctorius', scope: 'species', listing: 'CITES Appendix II' },
]

/** The listing that covers a lot's species (its botanical name first, as "Dalbergia stevensonii"), or null. */
export function listedTimberFor(species: string): ListedTimber | null {
  const words = species.trim().toLowerCase().split(/[\s,;()]+/).filter(Boolean)
  return LISTED_TIMBER.find((entry) => {
    const name = entry.name.toLowerCase().split(' ')
    return name.every((part, i) => words[i] === part)
  }) ?? null
}

/** Why a lot of this species may not be recorded without a permit number, or null. */
export function permitProblem(species: string, permitNumber: string): string | null {
  const listed = listedTimberFor(species)
  if (!listed || permitNumber.trim()) return null
  return `${listed.name} is a listed species (${listed.listing}): give the permit or certificate number.`
}
