import type { StoredTemplatePartial } from '../database/schema'
import type { TemplateFamily } from '../../shared/records/lists'

export interface StarterTemplate {
  family: TemplateFamily
  name: string
  partials: StoredTemplatePartial[]
  searchWindowCents: number
  referenceTemperatureC: number
  temperatureCoefficientCentsPerC: number
  notes: string
  source: string
}

const p = (label: string, ratio: number, toleranceCents: number, required = true): StoredTemplatePartial =>
  ({ label, ratio, toleranceCents, required })

// Temperature coefficients (cents per °C, negative: flatter when warmer), from memory
// where no better source is at hand: a bar's frequency goes with the square root of
// its Young's modulus, which falls as the material warms.
const ROSEWOOD = -0.9
const ALUMINIUM = -0.4
const STEEL = -0.15
const BRONZE = -0.35

/** The library every new workshop starts with. Each entry says where its values come from. */
export const STARTER_TEMPLATES: StarterTemplate[] = [
  {
    family: 'bar', name: 'Marimba bar, triple (1 : 4 : 10)',
    partials: [p('fundamental', 1, 3), p('second (double octave)', 4, 5), p('third (triple octave and major third)', 10, 10)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: ROSEWOOD,
    notes: 'Rosewood or padauk bars with an undercut arch; third partial tuned on the lower and middle registers.',
    source: 'Ratios: Fletcher & Rossing, The Physics of Musical Instruments (2nd ed., 1998), ch. 19 (marimba bars tuned 1 : 4, often 1 : 4 : 10); tolerances: common practice; temperature coefficient: from memory, rosewood about −0.9 ¢/°C.',
  },
  {
    family: 'bar', name: 'Marimba bar, double (1 : 4)',
    partials: [p('fundamental', 1, 3), p('second (double octave)', 4, 5)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: ROSEWOOD,
    notes: 'Upper-register marimba bars, where the third partial is left free.',
    source: 'Ratios: Fletcher & Rossing (1998), ch. 19; tolerances: common practice; temperature coefficient: from memory, rosewood about −0.9 ¢/°C.',
  },
  {
    family: 'bar', name: 'Xylophone bar (1 : 3)',
    partials: [p('fundamental', 1, 3), p('second (twelfth)', 3, 6)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: ROSEWOOD,
    notes: 'Bright xylophone voicing with the second partial at the twelfth.',
    source: 'Ratios: Fletcher & Rossing (1998), ch. 19 (xylophone bars tuned 1 : 3); tolerances: common practice; temperature coefficient: from memory, rosewood about −0.9 ¢/°C.',
  },
  {
    family: 'bar', name: 'Xylophone bar, triple (1 : 3 : 6)',
    partials: [p('fundamental', 1, 3), p('second (twelfth)', 3, 6), p('third (two octaves and a fifth)', 6, 10)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: ROSEWOOD,
    notes: 'Xylophone bars with a tuned third partial.',
    source: 'Ratios: Bork, "Practical tuning of xylophone bars and resonators", Applied Acoustics 46 (1995) 103–127 (from memory); tolerances: common practice; temperature coefficient: from memory, rosewood about −0.9 ¢/°C.',
  },
  {
    family: 'bar', name: 'Vibraphone bar (1 : 4 : 10)',
    partials: [p('fundamental', 1, 3), p('second (double octave)', 4, 5), p('third', 10, 10, false)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: ALUMINIUM,
    notes: 'Aluminium bars; the third partial is reported but does not decide the verdict.',
    source: 'Ratios: Fletcher & Rossing (1998), ch. 19 (vibraphone bars tuned 1 : 4, third partial near 10); tolerances: common practice; temperature coefficient: from memory, aluminium about −0.4 ¢/°C.',
  },
  {
    family: 'plate', name: 'Glockenspiel bar (fundamental)',
    partials: [p('fundamental', 1, 3)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: STEEL,
    notes: 'Steel bars without an undercut: only the fundamental is tuned.',
    source: 'Fletcher & Rossing (1998), ch. 19 (glockenspiel overtones are not harmonic and not tuned); tolerance: common practice; temperature coefficient: from memory, steel about −0.15 ¢/°C.',
  },
  {
    family: 'note field', name: 'Steel note field (1 : 2 : 3)',
    partials: [p('fundamental', 1, 3), p('octave', 2, 5), p('twelfth', 3, 8)],
    searchWindowCents: 80, referenceTemperatureC: 25, temperatureCoefficientCentsPerC: STEEL,
    notes: 'Inner and middle note fields of a pan.',
    source: 'Ratios: Rossing, Science of Percussion Instruments (2000), steelpan chapter (from memory: second mode at the octave, third at the twelfth); tolerances: common practice; temperature coefficient: from memory, steel about −0.15 ¢/°C.',
  },
  {
    family: 'note field', name: 'Steel note field (1 : 2 : 4)',
    partials: [p('fundamental', 1, 3), p('octave', 2, 5), p('double octave', 4, 8)],
    searchWindowCents: 80, referenceTemperatureC: 25, temperatureCoefficientCentsPerC: STEEL,
    notes: 'Outer note fields tuned to octave and double octave.',
    source: 'Ratios: Rossing (2000), steelpan chapter (from memory); tolerances: common practice; temperature coefficient: from memory, steel about −0.15 ¢/°C.',
  },
  {
    family: 'note field', name: 'Handpan-style note field (1 : 2 : 3)',
    partials: [p('fundamental', 1, 3), p('octave', 2, 5), p('compound fifth', 3, 8)],
    searchWindowCents: 80, referenceTemperatureC: 25, temperatureCoefficientCentsPerC: STEEL,
    notes: 'Dimpled note fields on a shell, tuned to the octave and compound fifth.',
    source: 'Ratios: common practice (octave and compound fifth); temperature coefficient: from memory, steel about −0.15 ¢/°C.',
  },
  {
    family: 'bell', name: 'Minor-third bell (hum, prime, tierce, quint, nominal)',
    partials: [p('hum', 0.5, 10), p('prime', 1, 4), p('tierce', 1.2, 6), p('quint', 1.5, 15, false), p('nominal', 2, 4)],
    searchWindowCents: 150, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: BRONZE,
    notes: 'True-harmonic church and carillon bells; the prime is the target note.',
    source: 'Ratios: Rossing, Science of Percussion Instruments (2000), bells chapter (hum 0.5, prime 1, minor-third tierce 1.2, quint 1.5, nominal 2); tolerances: common practice; temperature coefficient: from memory, bronze about −0.35 ¢/°C.',
  },
  {
    family: 'bell', name: 'Major-third bell (tierce 1.25)',
    partials: [p('hum', 0.5, 10), p('prime', 1, 4), p('tierce', 1.25, 6), p('quint', 1.5, 15, false), p('nominal', 2, 4)],
    searchWindowCents: 150, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: BRONZE,
    notes: 'Major-third bells, with the tierce a major third above the prime.',
    source: 'Ratios: Rossing (2000), bells chapter (major-third bell, tierce 1.25); tolerances: common practice; temperature coefficient: from memory, bronze about −0.35 ¢/°C.',
  },
  {
    family: 'membrane', name: 'Timpani (1 : 1.5 : 2 : 2.5)',
    partials: [p('principal (1,1)', 1, 5), p('fifth (2,1)', 1.5, 10), p('octave (3,1)', 2, 12), p('(4,1)', 2.5, 15, false)],
    searchWindowCents: 120, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: 0,
    notes: 'Head tension moves with humidity rather than temperature; no coefficient is applied.',
    source: 'Ratios: Fletcher & Rossing (1998), ch. 18 (timpani modes (1,1)…(4,1) near 1 : 1.5 : 2 : 2.5); tolerances: common practice.',
  },
  {
    family: 'membrane', name: 'Loaded drum head (1 : 2 : 3 : 4 : 5)',
    partials: [p('fundamental', 1, 5), p('second', 2, 8), p('third', 3, 10), p('fourth', 4, 12, false), p('fifth', 5, 15, false)],
    searchWindowCents: 120, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: 0,
    notes: 'Heads loaded with a central patch so that the overtones fall on harmonics.',
    source: 'Ratios: Raman, "The Indian musical drums", Proc. Indian Acad. Sci. A1 (1934) 179–188 (harmonic overtones of the loaded head); tolerances: common practice.',
  },
  {
    family: 'tine', name: 'Kalimba-style tine (fundamental)',
    partials: [p('fundamental', 1, 4)],
    searchWindowCents: 100, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: STEEL,
    notes: 'Spring-steel tines, tuned by sliding the tine in its bridge.',
    source: 'Tolerance: common practice; temperature coefficient: from memory, steel about −0.15 ¢/°C.',
  },
]
