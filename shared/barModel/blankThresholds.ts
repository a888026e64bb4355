import type { BarMaterial } from '../records/barMaterials'

/** A species' limits for a blank: stiffness per density at least, loss factor at most. */
export interface BlankThreshold {
  /** E/ρ in GPa per g/cm³ for a select blank, and for a usable one. */
  specificModulus: { select: number, usable: number }
  /** Loss factor η for a select blank, and for a usable one. */
  lossFactor: { select: number, usable: number }
}

/**
 * Starting thresholds per species, from memory of typical along-grain figures (tonewood
 * blanks with a high E/ρ and a low η ring longer and tune more easily); a workshop's own
 * figures replace these once stored. Metals vary little, so their bands are narrow.
 */
export const BLANK_THRESHOLDS: Record<BarMaterial, BlankThreshold> = {
  rosewood: { specificModulus: { select: 22, usable: 17 }, lossFactor: { select: 0.008, usable: 0.012 } },
  padauk: { specificModulus: { select: 18, usable: 14 }, lossFactor: { select: 0.010, usable: 0.015 } },
  aluminium: { specificModulus: { select: 25, usable: 23.5 }, lossFactor: { select: 0.0005, usable: 0.002 } },
  steel: { specificModulus: { select: 25, usable: 23.5 }, lossFactor: { select: 0.0005, usable: 0.002 } },
  bronze: { specificModulus: { select: 12, usable: 11 }, lossFactor: { select: 0.001, usable: 0.003 } },
}
