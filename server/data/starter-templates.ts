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

/**
 * What a template's material decides: its temperature coefficient in cents per °C (negative:
 * flatter when warmer), from memory where no better source is at hand: a bar's frequency goes
 * with the square root of its Young's modulus, which falls as the material warms. A drum head's
 * tension moves with humidity rather than temperature, so it gets none.
 */
const COEFFICIENT_CENTS_PER_C = { rosewood: -0.9, aluminium: -0.4, steel: -0.15, bronze: -0.35, head: 0 }
type Material = keyof typeof COEFFICIENT_CENTS_PER_C

/** What a template's family decides: how far from each ratio a partial is looked for, and the reference temperature. */
const FAMILY_SETTINGS = {
  'bar': { searchWindowCents: 100, referenceTemperatureC: 20 },
  'plate': { searchWindowCents: 100, referenceTemperatureC: 20 },
  'note field': { searchWindowCents: 80, referenceTemperatureC: 25 },
  'bell': { searchWindowCents: 150, referenceTemperatureC: 20 },
  'membrane': { searchWindowCents: 120, referenceTemperatureC: 20 },
  'tine': { searchWindowCents: 100, referenceTemperatureC: 20 },
} satisfies Partial<Record<TemplateFamily, Pick<StarterTemplate, 'searchWindowCents' | 'referenceTemperatureC'>>>

/** One starter template; `source` names where the ratios and tolerances come from, and the coefficient's source is added. */
function starter(family: keyof typeof FAMILY_SETTINGS, material: Material, name: string, partials: StoredTemplatePartial[], notes: string, source: string): StarterTemplate {
  const coefficient = COEFFICIENT_CENTS_PER_C[material]
  const coefficientSource = coefficient === 0 ? '' : `; temperature coefficient: from memory, ${material} about \u2212${Math.abs(coefficient)} ¢/°C`
  return { family, name, partials, ...FAMILY_SETTINGS[family], temperatureCoefficientCentsPerC: coefficient, notes, source: `${source}${coefficientSource}.` }
}

/** The library every new workshop starts with. Each entry says where its values come from. */
export const STARTER_TEMPLATES: StarterTemplate[] = [
  starter('bar', 'rosewood', 'Marimba bar, triple (1 : 4 : 10)', [p('fundamental', 1, 3), p('second (double octave)', 4, 5), p('third (triple octave and major third)', 10, 10)],
    'Rosewood or padauk bars with an undercut arch; third partial tuned on the lower and middle registers.',
    'Ratios: Fletcher & Rossing, The Physics of Musical Instruments (2nd ed., 1998), ch. 19 (marimba bars tuned 1 : 4, often 1 : 4 : 10); tolerances: common practice'),
  starter('bar', 'rosewood', 'Marimba bar, double (1 : 4)', [p('fundamental', 1, 3), p('second (double octave)', 4, 5)],
    'Upper-register marimba bars, where the third partial is left free.',
    'Ratios: Fletcher & Rossing (1998), ch. 19; tolerances: common practice'),
  starter('bar', 'rosewood', 'Xylophone bar (1 : 3)', [p('fundamental', 1, 3), p('second (twelfth)', 3, 6)],
    'Bright xylophone voicing with the second partial at the twelfth.',
    'Ratios: Fletcher & Rossing (1998), ch. 19 (xylophone bars tuned 1 : 3); tolerances: common practice'),
  starter('bar', 'rosewood', 'Xylophone bar, triple (1 : 3 : 6)', [p('fundamental', 1, 3), p('second (twelfth)', 3, 6), p('third (two octaves and a fifth)', 6, 10)],
    'Xylophone bars with a tuned third partial.',
    'Ratios: Bork, "Practical tuning of xylophone bars and resonators", Applied Acoustics 46 (1995) 103–127 (from memory); tolerances: common practice'),
  starter('bar', 'aluminium', 'Vibraphone bar (1 : 4 : 10)', [p('fundamental', 1, 3), p('second (double octave)', 4, 5), p('third', 10, 10, false)],
    'Aluminium bars; the third partial is reported but does not decide the verdict.',
    'Ratios: Fletcher & Rossing (1998), ch. 19 (vibraphone bars tuned 1 : 4, third partial near 10); tolerances: common practice'),
  starter('plate', 'steel', 'Glockenspiel bar (fundamental)', [p('fundamental', 1, 3)],
    'Steel bars without an undercut: only the fundamental is tuned.',
    'Fletcher & Rossing (1998), ch. 19 (glockenspiel overtones are not harmonic and not tuned); tolerance: common practice'),
  starter('note field', 'steel', 'Steel note field (1 : 2 : 3)', [p('fundamental', 1, 3), p('octave', 2, 5), p('twelfth', 3, 8)],
    'Inner and middle note fields of a pan.',
    'Ratios: Rossing, Science of Percussion Instruments (2000), steelpan chapter (from memory: second mode at the octave, third at the twelfth); tolerances: common practice'),
  starter('note field', 'steel', 'Steel note field (1 : 2 : 4)', [p('fundamental', 1, 3), p('octave', 2, 5), p('double octave', 4, 8)],
    'Outer note fields tuned to octave and double octave.',
    'Ratios: Rossing (2000), steelpan chapter (from memory); tolerances: common practice'),
  starter('note field', 'steel', 'Handpan-style note field (1 : 2 : 3)', [p('fundamental', 1, 3), p('octave', 2, 5), p('compound fifth', 3, 8)],
    'Dimpled note fields on a shell, tuned to the octave and compound fifth.',
    'Ratios: common practice (octave and compound fifth)'),
  starter('bell', 'bronze', 'Minor-third bell (hum, prime, tierce, quint, nominal)', [p('hum', 0.5, 10), p('prime', 1, 4), p('tierce', 1.2, 6), p('quint', 1.5, 15, false), p('nominal', 2, 4)],
    'True-harmonic church and carillon bells; the prime is the target note.',
    'Ratios: Rossing, Science of Percussion Instruments (2000), bells chapter (hum 0.5, prime 1, minor-third tierce 1.2, quint 1.5, nominal 2); tolerances: common practice'),
  starter('bell', 'bronze', 'Major-third bell (tierce 1.25)', [p('hum', 0.5, 10), p('prime', 1, 4), p('tierce', 1.25, 6), p('quint', 1.5, 15, false), p('nominal', 2, 4)],
    'Major-third bells, with the tierce a major third above the prime.',
    'Ratios: Rossing (2000), bells chapter (major-third bell, tierce 1.25); tolerances: common practice'),
  starter('membrane', 'head', 'Timpani (1 : 1.5 : 2 : 2.5)', [p('principal (1,1)', 1, 5), p('fifth (2,1)', 1.5, 10), p('octave (3,1)', 2, 12), p('(4,1)', 2.5, 15, false)],
    'Head tension moves with humidity rather than temperature; no coefficient is applied.',
    'Ratios: Fletcher & Rossing (1998), ch. 18 (timpani modes (1,1)…(4,1) near 1 : 1.5 : 2 : 2.5); tolerances: common practice'),
  starter('membrane', 'head', 'Loaded drum head (1 : 2 : 3 : 4 : 5)', [p('fundamental', 1, 5), p('second', 2, 8), p('third', 3, 10), p('fourth', 4, 12, false), p('fifth', 5, 15, false)],
    'Heads loaded with a central patch so that the overtones fall on harmonics.',
    'Ratios: Raman, "The Indian musical drums", Proc. Indian Acad. Sci. A1 (1934) 179–188 (harmonic overtones of the loaded head); tolerances: common practice'),
  starter('tine', 'steel', 'Kalimba-style tine (fundamental)', [p('fundamental', 1, 4)],
    'Spring-steel tines, tuned by sliding the tine in its bridge.',
    'Tolerance: common practice'),
]
