import pdfmake from 'pdfmake'
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces'
import QRCode from 'qrcode'
import type { CertificateContent, CertificatePartial } from '../../shared/certificates/content'
import { materialLotsText } from '../../shared/certificates/materialLotsText'
import { formatCents, partialState } from '../../shared/format/numbers'
import { CERTIFICATE_MEANING, lookHex, PARTIAL_MEANING, verdictMeaning, type Meaning } from '../../shared/look/meanings'
import { markSvg } from '../../shared/look/markSvg'
import { hex, WHITE } from '../../shared/look/palette'
import { CERTIFICATE_STATUSES, isOneOf } from '../../shared/records/lists'
import { budgetAnnex, calibrationBlock, decisionCell, plusMinusText } from './certificate-pdf-annex'
import { configurePdfFonts } from './certificate-pdf-fonts'

export type Paper = 'A4' | 'LETTER'

const INK = hex('ink')
const SOFT = hex('ink-soft')
const FAINT = hex('ink-faint')
const LINE = hex('paper-line')
const BRASS = hex('brass-500')

/** Shape and colour together, as on screen: filled circle, up triangle, down triangle, hollow square. */
const markOf = (q: CertificatePartial) => PARTIAL_MEANING[partialState(q)]

/** The piece's verdict word in the colour of its worst required partial, as the screens show it. */
function verdictColour(p: CertificateContent['pieces'][number]): string {
  const worst = p.partials.filter(q => q.required && !q.within && q.cents !== null).sort((a, b) => Math.abs(b.cents!) - Math.abs(a.cents!))[0]
  return lookHex(verdictMeaning(p.verdict, worst?.cents)).colour
}

/** A certificate's standing in its own colour (superseded, revoked). */
function statusColour(status: string): string {
  const meaning: Meaning = isOneOf(CERTIFICATE_STATUSES, status) ? CERTIFICATE_MEANING[status] : 'revoked'
  return lookHex(meaning).colour
}

const hz = (v: number | null) => (v === null ? '—' : `${v.toFixed(2)} Hz`)
const num = (v: number) => (v < 0 ? `−${Math.abs(v)}` : String(v))
const range = (r: { min: number, max: number } | null, unit: string) =>
  !r ? 'not recorded' : r.min === r.max ? `${num(r.min)} ${unit}` : `${num(r.min)} ${unit} to ${num(r.max)} ${unit}`

function pieceRow(p: CertificateContent['pieces'][number]): TableCell[] {
  const lines = (f: (q: CertificatePartial) => Content) => ({ stack: p.partials.map(f) })
  const verdictText = p.verdict === 'within' ? 'Pass' : p.verdict === 'outside' ? 'Outside' : 'Incomplete'
  return [
    { stack: [{ text: p.note, bold: true }, { text: `#${p.position}`, color: FAINT, fontSize: 7 }] },
    { text: hz(p.targetHz), font: 'PlexMono', alignment: 'right' },
    lines(q => ({ text: q.required ? q.label : `${q.label} (reported)`, noWrap: false })),
    lines(q => ({ text: hz(q.targetHz), font: 'PlexMono', alignment: 'right', color: SOFT })),
    lines(q => ({ text: hz(q.measuredHz), font: 'PlexMono', alignment: 'right' })),
    // ± U on the deviation's own line, so each partial stays on one line across the columns.
    lines(q => ({
      columns: [
        { svg: markSvg(markOf(q), 7), width: 9, margin: [0, 2, 0, 0] },
        { text: [{ text: formatCents(q.cents), color: lookHex(markOf(q)).colour }, { text: q.expandedUncertaintyCents !== null ? ` ${plusMinusText(q.expandedUncertaintyCents)}` : '', color: SOFT, fontSize: 7.5 }], font: 'PlexMono', alignment: 'right' },
      ],
    })),
    lines(q => ({ text: `±${q.toleranceCents} ¢`, font: 'PlexMono', alignment: 'right' })),
    {
      stack: [
        ...(p.decision ? decisionCell(p) : [{ text: verdictText, bold: true, color: verdictColour(p) }]),
        ...(p.overrideReason ? [{ text: `approved with override: ${p.overrideReason}`, fontSize: 7, color: SOFT }] : []),
      ],
    },
  ]
}

const heading = (text: string): Content => ({ text, style: 'h2' })

function field(label: string, value: string): Content[] {
  return [{ text: label, color: SOFT }, { text: value }]
}

/** The document definition of a certificate (pure: the same content gives the same layout). */
export async function certificateDocument(content: CertificateContent, status: string, paper: Paper): Promise<TDocumentDefinitions> {
  const qr = await QRCode.toDataURL(content.verificationUrl, { errorCorrectionLevel: 'M', margin: 0, width: 240, color: { dark: INK, light: WHITE } })
  const signedAt = new Date(content.signedAt)
  const signedText = `${signedAt.toISOString().slice(0, 10)} ${signedAt.toISOString().slice(11, 16)} UTC`
  const i = content.instrument
  const lots = materialLotsText(i.lots)
  return {
    pageSize: paper,
    pageMargins: [48, 62, 48, 58],
    info: { title: `Tuning certificate ${content.number}`, author: content.workshop.name, creator: 'Tonewright', subject: `${i.model} ${i.serial}` },
    defaultStyle: { font: 'Plex', fontSize: 9, color: INK, lineHeight: 1.2 },
    styles: {
      h1: { fontSize: 20, bold: true, margin: [0, 0, 0, 2] },
      h2: { fontSize: 10.5, bold: true, margin: [0, 12, 0, 4], color: INK },
      th: { bold: true, color: SOFT, fontSize: 8 },
      small: { fontSize: 8, color: SOFT },
    },
    // A revoked or superseded certificate says so across every page and in every header.
    ...(status !== 'valid' ? { watermark: { text: status.toUpperCase(), color: statusColour(status), opacity: 0.18, bold: true, angle: -40 } } : {}),
    header: (currentPage: number) => ({
      margin: [48, 24, 48, 0],
      columns: [
        { text: currentPage === 1 ? content.workshop.name : `Tuning certificate · ${content.workshop.name}`, color: SOFT, fontSize: 8 },
        { text: [`Certificate No. ${content.number}`, ...(status !== 'valid' ? [{ text: ` · ${status.toUpperCase()}`, color: statusColour(status) }] : [])], alignment: 'right', bold: true, fontSize: 9 },
      ],
    }),
    footer: (currentPage: number, pageCount: number) => ({
      margin: [48, 16, 48, 0],
      columns: [
        { text: `Certificate No. ${content.number} · verify at ${content.verificationUrl}`, fontSize: 7.5, color: SOFT },
        { text: `page ${currentPage} of ${pageCount}`, alignment: 'right', fontSize: 8, width: 80 },
      ],
    }),
    content: [
      {
        columns: [
          {
            width: '*',
            stack: [
              { text: 'Tuning certificate', style: 'h1' },
              { text: [{ text: 'No. ', color: SOFT }, { text: content.number, bold: true }, ...(status !== 'valid' ? [{ text: `  (${status.toUpperCase()})`, color: statusColour(status), bold: true }] : [])], fontSize: 12 },
              ...(content.supersedes ? [{ text: `Supersedes certificate ${content.supersedes}.`, style: 'small', margin: [0, 2, 0, 0] } as Content] : []),
              {
                margin: [0, 12, 0, 0],
                columns: [
                  { stack: [{ text: 'Issued by', style: 'th' }, { text: content.workshop.name, bold: true }, { text: content.workshop.address || '—' }] },
                  { stack: [{ text: 'Issued to', style: 'th' }, { text: content.buyer.organisation || content.buyer.name, bold: true }, ...(content.buyer.organisation ? [{ text: content.buyer.name }] : [])] },
                ],
                columnGap: 16,
              },
            ],
          },
          { width: 92, stack: [{ image: qr, width: 88 }, { text: 'Scan to verify', style: 'small', alignment: 'center', margin: [0, 3, 0, 0] }] },
        ],
        columnGap: 16,
      },
      heading('Instrument'),
      {
        table: {
          widths: [90, '*', 90, '*'],
          body: [
            [...field('Model', i.model), ...field('Serial number', i.serial)],
            [...field('Name', i.name), ...field('Range', i.range)],
            [...field('Pieces', `${i.pieceCount}${i.scrappedCount ? ` (${i.scrappedCount} scrapped, not listed)` : ''}`), ...field('Reference pitch', `A4 = ${content.referenceHz} Hz, ${content.temperament}`)],
            // Every lot on one line across the table, not squeezed into one of its four columns.
            [{ text: 'Material lots', color: SOFT }, { text: lots, colSpan: 3 }, { text: '' }, { text: '' }],
          ],
        },
        layout: 'noBorders',
      },
      heading('Measurement conditions'),
      {
        table: {
          widths: [90, '*', 90, '*'],
          body: [[...field('Temperature', range(content.conditions.temperatureC, '°C')), ...field('Relative humidity', range(content.conditions.humidityPct, '%'))]],
        },
        layout: 'noBorders',
      },
      { text: `${content.conditions.statement} Conditions are the range over the ${content.conditions.strikeCount} approved strikes this certificate rests on.`, margin: [0, 2, 0, 0] },
      heading('Method'),
      { text: content.method },
      heading('Results'),
      {
        table: {
          headerRows: 1,
          dontBreakRows: true,
          widths: [28, 52, '*', 54, 54, 84, 38, 52],
          body: [
            [
              { text: 'Note', style: 'th' },
              { text: 'Target fundamental', style: 'th', alignment: 'right' },
              { text: 'Partial', style: 'th' },
              { text: 'Target', style: 'th', alignment: 'right' },
              { text: 'Measured', style: 'th', alignment: 'right' },
              { text: 'Deviation Δ', style: 'th', alignment: 'right' },
              { text: 'Tolerance', style: 'th', alignment: 'right' },
              { text: 'Verdict', style: 'th' },
            ],
            ...content.pieces.map(pieceRow),
          ],
        },
        layout: {
          hLineWidth: (row: number) => (row <= 1 ? 0.8 : 0.4),
          vLineWidth: () => 0,
          hLineColor: (row: number) => (row <= 1 ? INK : LINE),
          paddingTop: () => 3,
          paddingBottom: () => 3,
        },
      },
      { text: 'Deviation Δ = 1200 · log2(measured ÷ target), in cents (¢), with its expanded uncertainty ± U (k = 2) below it where a budget was made. Marks: filled circle within the tolerance, up triangle sharp and down triangle flat outside it, hollow square not found, half-filled circle conditional (the tolerance lies within ± U).', style: 'small', margin: [0, 4, 0, 0] },
      {
        unbreakable: true,
        stack: [
          heading('Decision rule'),
          { text: content.decisionRule },
          ...calibrationBlock(content),
          heading('Measurement uncertainty'),
          { text: content.uncertainty },
          heading('Signature'),
          {
            columns: [
              { stack: [{ text: 'Signed by', style: 'th' }, { text: content.signer.name, bold: true, fontSize: 11 }, { text: content.signer.role, color: SOFT }] },
              { stack: [{ text: 'Signed at', style: 'th' }, { text: signedText, font: 'PlexMono' }] },
              { stack: [{ text: 'Verification', style: 'th' }, { text: content.verificationUrl, link: content.verificationUrl, color: BRASS, fontSize: 8 }] },
            ],
            columnGap: 16,
          },
          { text: content.scope, margin: [0, 14, 0, 0], bold: true },
        ],
      },
      ...budgetAnnex(content),
    ],
  }
}

/** Renders a certificate to PDF bytes with the embedded Plex fonts. */
export async function renderCertificatePdf(content: CertificateContent, status: string, paper: Paper = 'A4'): Promise<Uint8Array> {
  configurePdfFonts()
  const doc = await certificateDocument(content, status, paper)
  const buffer = await pdfmake.createPdf(doc).getBuffer()
  return new Uint8Array(buffer)
}
