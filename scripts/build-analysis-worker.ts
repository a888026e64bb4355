import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { build, type Plugin } from 'esbuild'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..')

/** audio-decode names decoders for formats we never install (ape…); leave those out. */
const optionalDecoders: Plugin = {
  name: 'optional-decoders',
  setup(b) {
    b.onResolve({ filter: /^@audio\/decode-/ }, async (args) => {
      if (args.pluginData === 'retry') return undefined
      const found = await b.resolve(args.path, { kind: args.kind, resolveDir: args.resolveDir, pluginData: 'retry' })
      return found.errors.length > 0 ? { path: args.path, external: true } : found
    })
  },
}

/**
 * Bundles the analysis worker (server/workers/analysis.worker.ts, the engine and its
 * decoders) into `<serverDir>/workers/analysis.mjs`, where the built server's pool finds
 * it. Decoders stay in lazily loaded chunks beside it. Called by the Nitro `compiled`
 * hook in nuxt.config.ts after every production build.
 */
export async function buildAnalysisWorker(serverDir: string): Promise<string> {
  const outdir = join(serverDir, 'workers')
  await build({
    entryPoints: { analysis: join(ROOT, 'server/workers/analysis.worker.ts') },
    outdir,
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    outExtension: { '.js': '.mjs' },
    chunkNames: 'chunks/[name]-[hash]',
    // Some decoders are CommonJS that call require(); give the ESM bundle one.
    banner: { js: 'import { createRequire as __twCreateRequire } from "node:module"; const require = __twCreateRequire(import.meta.url);' },
    plugins: [optionalDecoders],
    logLevel: 'warning',
    legalComments: 'none',
  })
  return join(outdir, 'analysis.mjs')
}
