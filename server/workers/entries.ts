import { resolve } from 'node:path'

/**
 * Worker-thread entries built beside the server (`<output>/server/<name>.mjs`) by
 * the same Rollup run as the server itself, so they share its transforms and
 * externals. Added to Nitro's Rollup input from nuxt.config.ts.
 */
export const WORKER_ENTRIES: Record<string, string> = {
  'workers/certificate-pdf': 'server/workers/certificate-pdf.ts',
  'workers/bar-model': 'server/workers/bar-model.ts',
}

interface ModuleInfo { isExternal: boolean, importedIds: readonly string[] }
type ManualChunks = (id: string, api: { getModuleInfo: (id: string) => ModuleInfo | null }) => string | null | undefined
interface RollupLike { input?: unknown, output?: unknown }

/** Every module a worker entry imports statically (the entry itself and externals left out). */
function reachable(entries: string[], info: (id: string) => ModuleInfo | null) {
  const seen = new Set<string>()
  const stack = entries.flatMap(e => info(e)?.importedIds ?? [])
  while (stack.length) {
    const id = stack.pop()!
    const module = info(id)
    if (seen.has(id) || !module || module.isExternal) continue
    seen.add(id)
    stack.push(...module.importedIds)
  }
  return seen
}

export function addWorkerEntries(config: RollupLike, rootDir: string) {
  if (typeof config.input !== 'string') return
  const files = Object.values(WORKER_ENTRIES).map(file => resolve(rootDir, file))
  config.input = { index: config.input, ...Object.fromEntries(Object.keys(WORKER_ENTRIES).map((name, i) => [name, files[i]])) }
  const output = (config.output ?? {}) as { entryFileNames?: unknown, manualChunks?: ManualChunks }
  output.entryFileNames = (chunk: { name: string }) => (chunk.name === 'index' ? 'index.mjs' : '[name].mjs')
  // The server's manual "nitro" chunk would otherwise take in what the workers import,
  // and a worker importing it would start a second server. Their modules get a chunk of their own.
  const serverChunks = output.manualChunks
  let workerModules: Set<string> | undefined
  output.manualChunks = (id, api) => {
    workerModules ??= reachable(files, api.getModuleInfo)
    if (workerModules.has(id)) return 'worker-modules'
    return serverChunks?.(id, api)
  }
  config.output = output
}
