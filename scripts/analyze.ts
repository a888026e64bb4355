// Command line: measure one strike.
//   npm run analyze -- FILE [--note C4] [--target-hz 261.63] [--reference-hz 442]
//     [--ratios 1,4,10] [--tolerances 2,5,8] [--temperature-c 24] [--calibration-ppm 41.3] [--json]
// Prints a table (units on every number) or, with --json, the analysis JSON.
// Bad input: one plain sentence on stderr and a non-zero exit.
import { readFile, stat } from 'node:fs/promises'
import { AnalysisError, LIMITS, analyzeStrike, parseAnalyzeOptions } from '../shared/analysis/index'
import type { AnalysisResult } from '../shared/analysis/index'

const FLAGS: Record<string, string> = {
  '--note': 'note',
  '--target-hz': 'targetHz',
  '--reference-hz': 'referenceHz',
  '--ratios': 'ratios',
  '--tolerances': 'tolerances',
  '--labels': 'labels',
  '--required': 'required',
  '--search-window-cents': 'searchWindowCents',
  '--temperature-c': 'temperatureC',
  '--reference-temperature-c': 'referenceTemperatureC',
  '--temperature-coefficient': 'temperatureCoefficientCentsPerC',
  '--attack-skip-s': 'attackSkipS',
  '--window-s': 'windowS',
  '--calibration-ppm': 'clockOffsetPpm',
}

const USAGE
  = 'Usage: npm run analyze -- FILE [--note C4] [--target-hz 261.63] [--reference-hz 442] '
    + '[--ratios 1,4,10] [--tolerances 2,5,8] [--temperature-c 24] [--calibration-ppm 41.3] [--json]'

class UsageError extends Error {}

function parseArgs(argv: string[]) {
  const fields: Record<string, string> = {}
  let file: string | undefined
  let json = false
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!
    if (arg === '--json') json = true
    else if (arg === '--help' || arg === '-h') throw new UsageError(USAGE)
    else if (arg.startsWith('--')) {
      const [flag, inline] = arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, undefined]
      const key = FLAGS[flag]
      if (!key) throw new UsageError(`${flag} is not an option; ${USAGE}`)
      const value = inline ?? argv[++i]
      if (value === undefined) throw new UsageError(`${flag} needs a value.`)
      fields[key] = value
    }
    else if (file === undefined) file = arg
    else throw new UsageError(`Give one file only (got "${file}" and "${arg}").`)
  }
  if (!file) throw new UsageError(USAGE)
  return { file, fields, json }
}

const fmt = (value: number | null | undefined, digits: number, unit: string) =>
  value === null || value === undefined ? '—' : `${value.toFixed(digits)} ${unit}`
const signed = (value: number | null, digits: number, unit: string) =>
  value === null ? '—' : `${value > 0 ? '+' : value < 0 ? '−' : '±'}${Math.abs(value).toFixed(digits)} ${unit}`

function table(rows: string[][]): string {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map(r => r[c]!.length)))
  return rows.map(r => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join('  ')).join('\n')
}

function render(result: AnalysisResult, file: string): string {
  const out: string[] = []
  out.push(`Tonewright analysis of ${file} (engine ${result.engineVersion})`)
  out.push(
    `${result.sampleRate} Hz, ${result.channels} channel${result.channels === 1 ? '' : 's'}, ${fmt(result.durationS, 3, 's')}; `
    + `strike at ${fmt(result.onsetS, 3, 's')}, analysed ${fmt(result.analysisStartS, 3, 's')} to ${fmt(result.analysisEndS, 3, 's')}`,
  )
  const p = result.parameters
  out.push(`Window ${p.window} ${fmt(p.windowS, 3, 's')} (from ${p.windowFrom}), zero-padding ×${p.zeroPad.toFixed(2)}, hop ${fmt(p.hopS, 4, 's')}`)
  out.push('')
  out.push(`Partials (${result.partials.length}):`)
  if (result.partials.length > 0) {
    out.push(
      table([
        ['#', 'frequency', 'amplitude', 'decay', 'T60', 'r²', 'start', 'end', 'stability', 'beat', 'modulation'],
        ...result.partials.map((q, i) => [
          String(i + 1),
          fmt(q.frequencyHz, 3, 'Hz'),
          fmt(q.amplitudeDb, 1, 'dB'),
          fmt(q.decayDbPerS, 2, 'dB/s'),
          fmt(q.t60S, 2, 's'),
          q.r2.toFixed(3),
          fmt(q.startS, 3, 's'),
          fmt(q.endS, 3, 's'),
          fmt(q.stabilityCents, 2, '¢'),
          fmt(q.beatHz, 2, 'Hz'),
          q.modulationHz === null ? '—' : `${fmt(q.modulationHz, 2, 'Hz')}, ${fmt(q.modulationDepthDb, 1, 'dB')}`,
        ]),
      ]),
    )
  }
  if (result.target && result.matches) {
    const t = result.target
    out.push('')
    out.push(
      `Target: ${t.note ? `${t.note}, ` : ''}fundamental ${fmt(t.fundamentalHz, 3, 'Hz')} (A4 = ${fmt(t.referenceHz, 1, 'Hz')})`
      + (result.temperatureC !== null && result.temperatureC !== undefined ? `, bench at ${result.temperatureC} °C` : ''),
    )
    out.push(
      table([
        ['partial', 'ratio', 'target', 'measured', 'cents', 'raw cents', 'tolerance', 'verdict'],
        ...result.matches.map(m => [
          m.label + (m.required ? '' : ' (optional)'),
          `×${m.ratio}`,
          fmt(m.targetHz, 3, 'Hz'),
          fmt(m.measuredHz, 3, 'Hz'),
          signed(m.cents, 2, '¢'),
          signed(m.rawCents, 2, '¢'),
          `±${m.toleranceCents} ¢`,
          m.missing ? 'missing' : m.within ? 'within' : `outside (${m.direction})`,
        ]),
      ]),
    )
    out.push('')
    out.push(`Verdict: ${result.verdict}`)
    for (const line of result.guidance) out.push(`  ${line}`)
  }
  else {
    out.push('')
    out.push(`Fundamental: ${fmt(result.fundamentalHz, 3, 'Hz')} (no target given, so no verdict)`)
  }
  if (result.warnings.length > 0) {
    out.push('')
    out.push('Warnings:')
    for (const w of result.warnings) out.push(`  ${w}`)
  }
  return out.join('\n')
}

async function main(): Promise<number> {
  const { file, fields, json } = parseArgs(process.argv.slice(2))
  // Validate options before reading a possibly large file.
  const options = parseAnalyzeOptions(fields)
  let size: number
  try {
    size = (await stat(file)).size
  }
  catch {
    throw new UsageError(`Cannot read "${file}": no such file.`)
  }
  if (size > LIMITS.maxBytes) throw new AnalysisError(413, 'too_large', 'The file is larger than 50 MB; record a single strike of at most 60 seconds.')
  const bytes = new Uint8Array(await readFile(file))
  // Some decoders log every bad frame of a damaged file to the console; the CLI promises
  // one sentence on stderr, so their chatter is held back while decoding.
  const { error: consoleError, warn: consoleWarn } = console
  console.error = () => {}
  console.warn = () => {}
  let result: AnalysisResult
  try {
    result = await analyzeStrike(bytes, options)
  }
  finally {
    console.error = consoleError
    console.warn = consoleWarn
  }
  process.stdout.write(json ? `${JSON.stringify(result, null, 2)}\n` : `${render(result, file)}\n`)
  return 0
}

main().then(
  code => process.exit(code),
  (error: unknown) => {
    if (error instanceof AnalysisError || error instanceof UsageError) {
      process.stderr.write(`${error.message}\n`)
      process.exit(error instanceof AnalysisError ? 1 : 2)
    }
    process.stderr.write(`The analysis failed unexpectedly: ${error instanceof Error ? error.message : String(error)}\n`)
    process.exit(3)
  },
)
