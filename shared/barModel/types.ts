/** One point of a bar's thickness profile: thickness at a distance from the left end (linear in between). */
export interface ProfileStation {
  xMm: number
  thicknessMm: number
}

/** A bar as the model sees it: a straight beam of rectangular section with a thickness profile. */
export interface BarGeometry {
  lengthMm: number
  widthMm: number
  /** Stations sorted by xMm, the first at 0 and the last at lengthMm (a uniform bar is two stations). */
  profile: readonly ProfileStation[]
  densityKgM3: number
  youngsModulusGPa: number
}

export interface BeamModelOptions {
  /** Finite elements along the bar (the profile's stations are added as nodes). */
  elements?: number
  /** 'euler-bernoulli' (default) or 'timoshenko' (shear and rotary inertia, for thick bars). */
  theory?: 'euler-bernoulli' | 'timoshenko'
  /** Shear modulus for the Timoshenko option; default E / 16, a usual figure along the grain of wood. */
  shearModulusGPa?: number
  /** Shear coefficient of the section for the Timoshenko option; default 5/6 for a rectangle. */
  shearCoefficient?: number
  /** Bending modes to return (rigid-body modes excluded); default 4. */
  modes?: number
}

/** Bending modes of a free–free bar, lowest first. */
export interface BarModes {
  frequenciesHz: Float64Array
  /** Node positions along the bar, m. */
  nodesM: Float64Array
  /** Each mode's degrees of freedom (deflection, rotation per node), mass-normalised. */
  shapes: Float64Array[]
}
