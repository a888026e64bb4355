import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { build } from 'esbuild'
import { nodeBundleOptions } from './esbuild-bundle.mjs'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..')

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
    ...nodeBundleOptions,
  })
  return join(outdir, 'analysis.mjs')
}
