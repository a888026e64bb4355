// Runs a command-line script as JavaScript precompiled by esbuild, so a call pays for
// Node's start and the work, not for a TypeScript loader:
//   node scripts/run-built.mjs analyze FILE ...      (what `npm run analyze -- FILE ...` runs)
//   node scripts/run-built.mjs bench-analysis        (what `npm run bench:analysis` runs: the engine timed as the server's
//                                                    analysis worker runs it, precompiled, not under a TypeScript loader)
//   node scripts/run-built.mjs --build analyze        (set-up: build now if stale)
// The bundle lives in .data/cli/<name>/ (TONEWRIGHT_CLI_DIR moves it) with the list of files it was made from (their
// sizes and modification times); it is rebuilt when one of them changed or it is missing.
// Plain JavaScript on purpose: it must run in a fresh clone where nothing is built yet.
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..')
/** The scripts that may be run this way, by name. */
const SCRIPTS = { 'analyze': 'scripts/analyze.ts', 'bench-analysis': 'scripts/bench-analysis.ts' }
const INPUTS_FILE = 'inputs.json'

/** A file's identity for staleness: size and modification time (a stat, no read: this runs at every call). */
function fingerprint(path) {
  try {
    const s = statSync(join(ROOT, path), { throwIfNoEntry: false })
    return s ? `${s.size}:${s.mtimeMs}` : 'missing'
  }
  catch {
    return 'missing'
  }
}

/** Whether the bundle in `dir` was made from the files as they are now. */
function isFresh(dir) {
  let recorded
  try {
    recorded = JSON.parse(readFileSync(join(dir, INPUTS_FILE), 'utf8'))
  }
  catch {
    return false
  }
  return Object.entries(recorded).every(([path, print]) => fingerprint(path) === print)
}

/** Bundles the script into a fresh folder, then swaps it in, so a concurrent call never runs half a bundle. */
async function build(name, dir) {
  // Loaded only to build, so a call with a fresh bundle does not pay for them.
  const [{ build: esbuild }, { nodeBundleOptions }] = await Promise.all([import('esbuild'), import('./esbuild-bundle.mjs')])
  const temporary = `${dir}.${process.pid}.tmp`
  rmSync(temporary, { recursive: true, force: true })
  const result = await esbuild({
    absWorkingDir: ROOT,
    entryPoints: { [name]: SCRIPTS[name] },
    outdir: temporary,
    ...nodeBundleOptions,
    metafile: true,
  })
  // Our own sources one by one; the packages through the lock file that pins them.
  const inputs = Object.keys(result.metafile.inputs).filter(path => !path.startsWith('node_modules/'))
  const recorded = Object.fromEntries([...inputs, 'package-lock.json', 'scripts/run-built.mjs', 'scripts/esbuild-bundle.mjs'].map(path => [path, fingerprint(path)]))
  writeFileSync(join(temporary, INPUTS_FILE), JSON.stringify(recorded))
  const old = `${dir}.${process.pid}.old`
  try {
    if (existsSync(dir)) renameSync(dir, old)
    renameSync(temporary, dir)
  }
  catch {
    // Another call swapped its own fresh build in at the same moment: use that one.
  }
  rmSync(old, { recursive: true, force: true })
  rmSync(temporary, { recursive: true, force: true })
}

async function main() {
  const args = process.argv.slice(2)
  const buildOnly = args[0] === '--build'
  const name = buildOnly ? args[1] : args[0]
  if (!name || !Object.hasOwn(SCRIPTS, name)) {
    process.stderr.write(`Usage: node scripts/run-built.mjs [--build] ${Object.keys(SCRIPTS).join('|')} [ARGS]\n`)
    process.exit(2)
  }
  const dir = join(process.env.TONEWRIGHT_CLI_DIR ? resolve(process.env.TONEWRIGHT_CLI_DIR) : join(ROOT, '.data', 'cli'), name)
  if (!isFresh(dir)) {
    mkdirSync(dirname(dir), { recursive: true })
    await build(name, dir)
  }
  if (buildOnly) return
  // The script reads its arguments from argv[2] on, as if it had been started itself; a bundle runs from
  // elsewhere, so the project's own files are found from TONEWRIGHT_ROOT (tests/support/realFixtures.ts).
  process.env.TONEWRIGHT_ROOT = ROOT
  process.argv = [process.argv[0], join(dir, `${name}.mjs`), ...args.slice(1)]
  await import(pathToFileURL(join(dir, `${name}.mjs`)).href)
}

await main()
