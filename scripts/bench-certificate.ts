/**
 * Certificate PDF figures: render time (median of N) and size for a 4.3-octave
 * marimba (52 pieces, three partials each), on A4 and US Letter.
 *
 *   npx tsx scripts/bench-certificate.ts [runs]
 */
import { cpus, loadavg } from 'node:os'
import { execFileSync } from 'node:child_process'
import { writeFileSync } from 'node:fs'
import { buildCertificateContent } from '../shared/certificates/content'
import { expandNoteRange } from '../shared/records/noteRange'
import { noteToFrequencyHz } from '../shared/analysis/noteToFrequencyHz'
import { renderCertificatePdf, type Paper } from '../server/utils/certificate-pdf'

const runs = Number(process.argv[2] ?? 5)
const notes = expandNoteRange('A2', 'C7', true)
const partials = [['fundamental', 1, 3], ['second (double octave)', 4, 5], ['third (triple octave and major third)', 10, 10]] as const
const content = buildCertificateContent({
  number: 'TW-2026-0042', verificationUrl: 'https://certificates.example.test/verify/Zq3v9Lw0aXbYcD2e', supersedes: null,
  signedAt: new Date('2026-03-14T09:30:00Z'), signer: { name: 'Ines Varga', role: 'Supervisor' },
  workshop: { name: 'Harbourside Bar Works', address: '12 Quay Lane, Port Amberly' },
  set: { name: 'Concert marimba', model: 'HM-43', serial: 'HM43-0042', fromNote: 'A2', toNote: 'C7', chromatic: true, buyerName: 'R. Okafor', buyerOrganisation: 'Millbrook School', buyerEmail: 'r@example.test', referenceHz: 442, temperament: 'equal' },
  scrappedCount: 0, lots: [{ id: 'l1', code: 'RW-24-07', material: 'rosewood', species: '' }],
  pieces: notes.map((note, i) => {
    const f0 = noteToFrequencyHz(note, 442)
    return {
      position: i + 1, note, targetHz: f0, lotId: 'l1', overrideReason: null,
      template: { name: 'Marimba bar, triple (1 : 4 : 10)', version: 1, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.9 },
      strike: {
        temperatureC: 21 + (i % 5) * 0.2, humidityPct: 45, verdict: 'within', engineVersion: '1.0.0',
        matches: partials.map(([label, ratio, tol], k) => {
          const cents = ((i * 7 + k * 3) % 9 - 4) / 2
          return { label, ratio, targetHz: f0 * ratio, measuredHz: f0 * ratio * 2 ** (cents / 1200), cents, rawCents: cents, normalizedCents: cents, toleranceCents: tol, within: Math.abs(cents) <= tol, missing: false, required: true, direction: null, amplitudeDb: -10 }
        }),
      },
    }
  }),
})

for (const paper of ['A4', 'LETTER'] as Paper[]) {
  await renderCertificatePdf(content, 'valid', paper)
  const times: number[] = []
  let bytes = new Uint8Array()
  for (let r = 0; r < runs; r++) {
    const t = performance.now()
    bytes = await renderCertificatePdf(content, 'valid', paper)
    times.push(performance.now() - t)
  }
  times.sort((a, b) => a - b)
  const file = `/tmp/tonewright-bench-certificate-${paper}.pdf`
  writeFileSync(file, bytes)
  let pages = '?'
  try {
    pages = /Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))?.[1] ?? '?'
  }
  catch { /* poppler-utils not installed */ }
  console.log(`${paper.padEnd(6)} ${notes.length} pieces: median ${times[Math.floor(runs / 2)]!.toFixed(0)} ms over ${runs} runs (min ${times[0]!.toFixed(0)} ms), ${(bytes.length / 1024).toFixed(0)} kB, ${pages} pages`)
}
console.log(`machine: ${cpus().length} cores, load average ${loadavg().map(l => l.toFixed(2)).join(' ')}`)
