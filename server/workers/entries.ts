import { resolve } from 'node:path'

/**
 * Worker-thread entries built beside the server (`<output>/server/<name>.mjs`) by
 * the same Rollup run as the server itself, so they share its transforms and
 * externals. Added to Nitro's Rollup input from nuxt.config.ts.
 */
export const WORKER_ENTRIES: Record<string, string> = {
  'workers/certificate-pdf': 'server/workers/certificate-pdf.ts',
}

interface RollupLike { input?: unknown, output?: unknown }

export function addWorkerEntries(config: RollupLike, rootDir: string) {
  if (typeof config.input !== 'string') return
  const workers = Object.fromEntries(Object.entries(WORKER_ENTRIES).map(([name, file]) => [name, resolve(rootDir, file)]))
  config.input = { index: config.input, ...workers }
  const output = (config.output ?? {}) as { entryFileNames?: unknown }
  output.entryFileNames = (chunk: { name: string }) => (chunk.name === 'index' ? 'index.mjs' : '[name].mjs')
  config.output = output
}
