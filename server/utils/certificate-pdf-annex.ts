import type { Content, TableCell } from 'pdfmake/interfaces'
import type { CertificateContent } from '../../shared/certificates/content'
import { roundUpCents } from '../../shared/certificates/uncertaintyText'
import { formatNumber } from '../../shared/format/numbers'
import { decisionMeaning, lookHex } from '../../shared/look/meanings'
import { markSvg } from '../../shared/look/markSvg'
import { hex } from '../../shared/look/palette'
import { statesExpandedUncertainty } from '../../shared/uncertainty/evidence'

type Piece = CertificateContent['pieces'][number]
const SOFT = hex('ink-soft')
const LINE = hex('paper-line')
const INK = hex('ink')
const MADDER = lookHex('error').text

const signedPpm = (v: number) => `${v < 0 ? '−' : v > 0 ? '+' : ''}${Math.abs(v).toFixed(2)} ppm`

/** "± 0.25 ¢" beside a deviation, rounded up to two significant digits (JCGM 100:2008 §7.2.6). */
export const plusMinusText = (u: number | null) => (u === null ? '' : `± ${roundUpCents(u)} ¢`)

const VERDICT_TEXT = { pass: 'Pass', conditional: 'Conditional', fail: 'Fail' } as const

/** The piece's verdict under its decision rule, with its mark, and a note when the other rule would give another. */
export function decisionCell(p: Piece): Content[] {
  const d = p.decision!
  const worst = p.partials.filter(q => q.required && q.cents !== null).sort((a, b) => Math.abs(b.cents!) - Math.abs(a.cents!))[0]?.cents ?? null
  const meaning = decisionMeaning(d.verdict, worst)
  const other = d.rule === 'simple' ? 'guarded' : 'simple'
  return [
    { columns: [{ svg: markSvg(meaning, 7), width: 9, margin: [0, 2, 0, 0] }, { text: d.verdict ? VERDICT_TEXT[d.verdict] : 'Incomplete', bold: true, color: lookHex(meaning).text }] },
    ...(d.dependsOnRule ? [{ text: `depends on the rule (${other}: ${d.otherVerdict ?? 'none'})`, fontSize: 7, color: SOFT } as Content] : []),
  ]
}

/** The input calibrations the strikes were measured under; an expired or missing one said plainly. */
export function calibrationBlock(content: CertificateContent): Content[] {
  if (content.uncalibratedPieceCount === null) return []
  const lines: Content[] = content.calibrations.map(c => ({
    text: [
      { text: c.device, bold: true },
      `, calibrated ${c.calibratedAt.slice(0, 10)}: offset ${signedPpm(c.offsetPpm)} ± ${c.uncertaintyPpm.toFixed(2)} ppm (k = 1), ${c.pieceCount} piece${c.pieceCount === 1 ? '' : 's'}`,
      c.driftAssessed ? '' : '; drift not assessed (one calibration of this input)',
      ...(c.expired ? [{ text: '; EXPIRED when the strikes were made', bold: true, color: MADDER }] : []),
      '.',
    ],
  }))
  if (content.uncalibratedPieceCount > 0) {
    lines.push({ text: `${content.uncalibratedPieceCount} piece${content.uncalibratedPieceCount === 1 ? ' was' : 's were'} measured with no input calibration (MISSING): the clock of the sound input is not assessed for ${content.uncalibratedPieceCount === 1 ? 'it' : 'them'}.`, bold: true, color: MADDER })
  }
  if (!lines.length) lines.push({ text: 'No input calibration is recorded for these strikes.' })
  return [{ text: 'Input calibration', style: 'h2' }, ...lines]
}

function budgetTable(p: Piece): Content {
  const th = (text: string, alignment: 'left' | 'right' = 'left'): TableCell => ({ text, style: 'th', alignment })
  const body: TableCell[][] = [[th('Partial'), th('Component'), th('Value', 'right'), th('Distribution'), th('Sensitivity', 'right'), th('Contribution', 'right')]]
  for (const b of p.budget) {
    b.lines.forEach((l, i) => body.push([
      i === 0 ? { text: b.label, bold: true } : '', l.name, { text: formatNumber(l.value, l.unit, 4), alignment: 'right' },
      `${l.distribution} (÷${l.divisor.toFixed(3)})`, { text: formatNumber(l.sensitivity, `¢/${l.unit}`, l.unit === 'ppm' ? 5 : l.unit === '¢' ? 0 : 2), alignment: 'right' },
      { text: formatNumber(l.contribution, '¢', 4), alignment: 'right' },
    ]))
    const total = statesExpandedUncertainty(b.notAssessed)
      ? `u = ${formatNumber(b.combinedStandardUncertaintyCents, '¢', 4)}, U = k·u = ${formatNumber(b.expandedUncertaintyCents, '¢', 4)} (k = ${b.coverageFactor})`
      : 'u and U not stated: the engine that measured this strike gave no estimate of its own'
    body.push(['', { text: total, bold: true, colSpan: 5 }, '', '', '', ''])
    if (b.notAssessed.length) {
      body.push(['', { text: `Not assessed: ${b.notAssessed.map(g => `${g.name} (${g.reason})`).join('; ')}.`, colSpan: 5, color: SOFT }, '', '', '', ''])
    }
  }
  return {
    table: { headerRows: 1, dontBreakRows: true, widths: [70, 100, 62, '*', 62, 58], body },
    layout: { hLineWidth: (row: number) => (row <= 1 ? 0.8 : 0.3), vLineWidth: () => 0, hLineColor: (row: number) => (row <= 1 ? INK : LINE), paddingTop: () => 2, paddingBottom: () => 2 },
    fontSize: 7.5,
  }
}

/** The annex: one budget table per piece (JCGM 100:2008 §5, k = 2), on pages of its own. */
export function budgetAnnex(content: CertificateContent): Content[] {
  const pieces = content.pieces.filter(p => p.budget.length)
  if (!pieces.length) return []
  return [
    { text: 'Annex: uncertainty budgets', style: 'h1', pageBreak: 'before' },
    { text: 'For each partial: each component\'s stated value, its distribution and divisor, its sensitivity coefficient c and its contribution |c|·u to the deviation in cents; u = √Σ(c·u)² over the components, U = k·u with k = 2 (JCGM 100:2008 §5.1.2, §6.2.1).', style: 'small', margin: [0, 0, 0, 6] },
    ...pieces.flatMap(p => [
      { text: `${p.note} (#${p.position}) · ${p.template}`, style: 'h2', margin: [0, 8, 0, 2] } as Content,
      ...(p.clock ? [{ text: `Input clock: ${p.clock}`, style: 'small', margin: [0, 0, 0, 3] } as Content] : []),
      budgetTable(p),
    ]),
  ]
}
