import { eq, sql } from 'drizzle-orm'
import type { Executor, Transaction } from '../client'
import { lots, pieces, reviews, strikeAnalyses, strikes, templateVersions, users } from '../schema'
import { analyzeSamples } from '../../../shared/analysis/analyzeSamples'
import { encodeWav } from '../../../shared/analysis/encodeWav'
import type { AnalysisResult } from '../../../shared/analysis/types'
import { seededRandom } from '../../../shared/synthesis/seededRandom'
import { synthStrike, type SynthPartial } from '../../../shared/synthesis/synthStrike'
import type { PieceStage } from '../../../shared/records/stages'
import { createSet } from '../../utils/sets'
import { worstCents } from '../../utils/strikes'
import { benchInputCalibration, seedDemoCalibrations } from './demo-calibrations'
import type { BlobStorage } from '../../utils/storage'

const SAMPLE_RATE = 44100
const DURATION_S = 1.4

export interface People { owner: string, supervisor: string, bench: string, office: string }

/**
 * How far along each piece is. The marimba is mid-way: its low bars approved, the
 * middle in review and tuning, the top still blank; the glockenspiel is nearly done.
 */
function marimbaStage(i: number, n: number): PieceStage {
  if (i === 7) return 'rework'
  if (i === 12) return 'scrapped'
  const f = i / n
  if (f < 0.35) return 'approved'
  if (f < 0.5) return 'review'
  if (f < 0.7) return 'tuning'
  if (f < 0.85) return 'roughed'
  return 'blank'
}

function glockStage(i: number, n: number): PieceStage {
  if (i >= n - 2) return 'review'
  if (i === n - 3) return 'tuning'
  return 'approved'
}

/** Cents of each partial on strike k of `count`: starts sharp, closes in on the target. */
function deviations(random: ReturnType<typeof seededRandom>, partials: number, count: number, finishWithin: boolean, tolerances: number[]) {
  const start = Array.from({ length: partials }, (_, j) => (12 + 40 * random.uniform()) * (j === 0 ? 1 : 1.4))
  const out: number[][] = []
  for (let k = 0; k < count; k++) {
    const left = count === 1 ? 0 : 1 - k / (count - 1)
    out.push(start.map((s, j) => {
      const tol = tolerances[j] ?? 5
      const last = finishWithin ? (random.uniform() - 0.5) * 1.2 * tol : tol * (1.6 + random.uniform())
      return last + (s - last) * left ** 1.5
    }))
  }
  // A finished piece is struck twice more as it is (the repeatability of its budget): a few tenths of a cent apart.
  const final = out.at(-1)
  if (finishWithin && final) {
    for (let r = 0; r < FINAL_REPEATS; r++) out.push(final.map(d => d + (random.uniform() - 0.5) * 0.4))
  }
  return out
}

/** Extra strikes of a finished demo piece at its final state. */
const FINAL_REPEATS = 2

function strikeCountFor(stage: PieceStage, random: ReturnType<typeof seededRandom>) {
  if (stage === 'blank' || stage === 'scrapped') return 0
  if (stage === 'roughed') return 1
  return 2 + Math.floor(random.uniform() * 3)
}

export async function seedSetStrikes(
  db: Transaction, storage: BlobStorage, workshopId: string, setId: string, people: People,
  stageOf: (i: number, n: number) => PieceStage, seed: number, decayScale: number,
  calibration?: { id: string, offsetPpm: number },
) {
  // An input reading `offsetPpm` high hears every partial that much higher; the engine corrects it back.
  const readHigh = 1 + (calibration?.offsetPpm ?? 0) * 1e-6
  const random = seededRandom(seed)
  const rows = await db.select({ piece: pieces, template: templateVersions }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(eq(pieces.setId, setId)).orderBy(pieces.position)
  const now = Date.now()
  for (const [i, { piece, template }] of rows.entries()) {
    const stage = stageOf(i, rows.length)
    const count = strikeCountFor(stage, random)
    const tolerances = template.partials.map(p => p.toleranceCents)
    const finishWithin = stage === 'approved' || stage === 'review' ? random.uniform() > 0.12 || stage === 'approved' : false
    const devs = deviations(random, template.partials.length, count, finishWithin, tolerances)
    let last: { id: string, result: AnalysisResult, at: Date } | null = null
    await db.transaction(async (tx) => {
      for (let k = 0; k < devs.length; k++) {
        const temperatureC = 20.5 + random.uniform() * 3
        // The deviations are meant at the template's reference temperature; a warmer bar reads flatter.
        const drift = template.temperatureCoefficientCentsPerC * (temperatureC - template.referenceTemperatureC)
        const partials: SynthPartial[] = template.partials.map((p, j) => ({
          frequencyHz: piece.targetHz * p.ratio * 2 ** ((devs[k]![j]! + drift) / 1200) * readHigh,
          amplitudeDb: -8 - 7 * j,
          decayDbPerS: decayScale * (8 + piece.targetHz * p.ratio / 90),
        }))
        const samples = synthStrike(partials, { sampleRate: SAMPLE_RATE, durationS: DURATION_S, onsetS: 0.05, noiseDb: -70, seed: seed * 1000 + i * 10 + k })
        const result = analyzeSamples(samples, SAMPLE_RATE, {
          note: piece.note, targetHz: piece.targetHz, temperatureC, clockOffsetPpm: calibration?.offsetPpm,
          template: {
            partials: template.partials, searchWindowCents: template.searchWindowCents,
            referenceTemperatureC: template.referenceTemperatureC, temperatureCoefficientCentsPerC: template.temperatureCoefficientCentsPerC,
          },
        })
        const at = new Date(now - (rows.length - i) * 3 * 3600_000 - (devs.length - k) * 600_000)
        const id = crypto.randomUUID()
        const audioKey = `workshops/${workshopId}/strikes/${piece.id}/${id}.wav`
        await storage.put(audioKey, encodeWav(samples, SAMPLE_RATE), 'audio/wav')
        await tx.insert(strikes).values({
          id, workshopId, pieceId: piece.id, userId: k % 3 === 2 ? people.supervisor : people.bench, stage: k === 0 ? 'roughed' : 'tuning',
          temperatureC, humidityPct: 38 + random.uniform() * 12, audioKey, audioBytes: 44 + samples.length * 2, audioType: 'audio/wav',
          audioName: `${piece.note}-${k + 1}.wav`, engineVersion: result.engineVersion, analysis: result, templateVersionId: template.id,
          fundamentalHz: result.fundamentalHz, worstCents: worstCents(result), verdict: result.verdict, createdAt: at, calibrationId: calibration?.id ?? null,
        })
        await tx.insert(strikeAnalyses).values({
          workshopId, strikeId: id, engineVersion: result.engineVersion, analysis: result, verdict: result.verdict, worstCents: worstCents(result),
          fundamentalHz: result.fundamentalHz, applied: true, reason: 'recorded', createdAt: at,
        })
        last = { id, result, at }
      }
      const l = last as { id: string, result: AnalysisResult, at: Date } | null
      await tx.update(pieces).set({
        stage, strikeCount: devs.length, assigneeId: stage === 'blank' ? null : people.bench,
        latestStrikeId: l?.id ?? null, latestVerdict: l?.result.verdict ?? null, latestWorstCents: l ? worstCents(l.result) : null,
        latestFundamentalHz: l?.result.fundamentalHz ?? null, latestStrikeAt: l?.at ?? null,
        approvedStrikeId: stage === 'approved' ? l?.id ?? null : null, approvedAt: stage === 'approved' ? l?.at ?? null : null,
        reworkCount: stage === 'rework' || (stage === 'approved' && i % 7 === 3) ? 1 : 0, updatedAt: l?.at ?? new Date(),
      }).where(eq(pieces.id, piece.id))
      if (stage === 'approved' && l && i % 7 === 3) {
        // Some pieces came back once before they passed: the first-pass yield is not 100 %.
        await tx.insert(reviews).values({ workshopId, pieceId: piece.id, strikeId: null, supervisorId: people.supervisor, decision: 'return', comment: 'Third partial flat; lower the fundamental a touch and recheck.', createdAt: new Date(l.at.getTime() - 3600_000) })
      }
      if (stage === 'approved' && l) {
        await tx.insert(reviews).values({ workshopId, pieceId: piece.id, strikeId: l.id, supervisorId: people.supervisor, decision: 'approve', createdAt: l.at })
      }
      if (stage === 'rework' && l) {
        await tx.insert(reviews).values({ workshopId, pieceId: piece.id, strikeId: l.id, supervisorId: people.supervisor, decision: 'return', comment: 'Second partial still sharp after the last cut; take a little more from the arch.', createdAt: l.at })
      }
    })
  }
}

async function templateIdByName(db: Executor, workshopId: string, name: string) {
  const [row] = await db.execute<{ id: string }>(sql`select id from ratio_templates where workshop_id = ${workshopId} and name = ${name}`)
  if (!row) throw new Error(`Starter template "${name}" is missing.`)
  return row.id
}

/** The demo workshop's lots, a 4.3-octave marimba and a 3-octave glockenspiel, with strikes. */
export async function seedDemoRecords(db: Transaction, storage: BlobStorage, workshopId: string) {
  const byEmail = async (email: string) => (await db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0]!.id
  const people: People = {
    owner: await byEmail('owner@tonewright.test'),
    supervisor: await byEmail('supervisor@tonewright.test'),
    bench: await byEmail('bench@tonewright.test'),
    office: await byEmail('office@tonewright.test'),
  }
  await db.insert(lots).values([
    { workshopId, code: 'RW-2611', material: 'rosewood', species: 'Dalbergia (billet batch)', supplier: 'Marrowgate Timber Yard', receivedOn: '2026-09-14', moisturePct: 9.5, permitNumber: 'MTY-EX-26-0917', documents: 'Timber trade paperwork on file, folder 26/11', notes: 'Quarter-sawn billets, air-dried 3 years.' },
    { workshopId, code: 'ST-0409', material: 'steel', species: 'spring steel, hardened', supplier: 'Coldharbour Bar Stock', receivedOn: '2026-10-02', documents: 'Mill certificate on file', notes: 'Bar stock 32 × 8 mm.' },
  ])
  const marimbaTriple = await templateIdByName(db, workshopId, 'Marimba bar, triple (1 : 4 : 10)')
  const marimbaDouble = await templateIdByName(db, workshopId, 'Marimba bar, double (1 : 4)')
  const glock = await templateIdByName(db, workshopId, 'Glockenspiel bar (fundamental)')
  const marimba = await createSet(db, workshopId, people.office, {
    name: 'Concert marimba for Linden Vale', model: 'Brackenfold BM-43 (4.3 octaves)', serial: 'BM43-0117',
    buyer: { name: 'Orla Venn', organisation: 'Linden Vale Youth Percussion', email: 'orla.venn@lindenvale.test' },
    referenceHz: 442, temperament: 'equal', noteOffsetsCents: {}, fromNote: 'A2', toNote: 'C7', chromatic: true,
    templateId: marimbaTriple, registers: [{ fromNote: 'C#6', toNote: 'C7', templateId: marimbaDouble }], dueOn: '2027-02-26',
  })
  const glockSet = await createSet(db, workshopId, people.office, {
    name: 'Orchestral glockenspiel for Fenwick Hall', model: 'Brackenfold GL-3 (3 octaves)', serial: 'GL3-0042',
    buyer: { name: 'Tamsin Orrell', organisation: 'Fenwick Hall Sinfonia', email: 'percussion@fenwickhall.test' },
    referenceHz: 442, temperament: 'equal', noteOffsetsCents: {}, fromNote: 'C5', toNote: 'C8', chromatic: true,
    templateId: glock, registers: [], dueOn: '2027-01-15',
  })
  const [rosewood, steel] = await db.select({ id: lots.id, code: lots.code }).from(lots).where(eq(lots.workshopId, workshopId)).orderBy(lots.code)
  await db.update(pieces).set({ lotId: rosewood!.code === 'RW-2611' ? rosewood!.id : steel!.id }).where(eq(pieces.setId, marimba.id))
  await db.update(pieces).set({ lotId: steel!.code === 'ST-0409' ? steel!.id : rosewood!.id }).where(eq(pieces.setId, glockSet.id))
  // Rosewood rings for a shorter time than steel.
  await seedDemoCalibrations(db, workshopId, people.bench)
  await seedSetStrikes(db, storage, workshopId, marimba.id, people, marimbaStage, 43, 1.6, await benchInputCalibration(db, workshopId))
  await seedSetStrikes(db, storage, workshopId, glockSet.id, people, glockStage, 37, 0.5)
  return people
}
