import { describe, expect, it } from 'vitest'
import { addWorkerEntries } from '../../../../server/workers/entries'

const graph: Record<string, { isExternal: boolean, importedIds: string[] }> = {
  '/app/server/workers/certificate-pdf.ts': { isExternal: false, importedIds: ['/app/server/utils/certificate-pdf.ts'] },
  '/app/server/utils/certificate-pdf.ts': { isExternal: false, importedIds: ['/app/shared/format/numbers.ts', 'pdfmake'] },
  '/app/shared/format/numbers.ts': { isExternal: false, importedIds: [] },
  'pdfmake': { isExternal: true, importedIds: [] },
  '/app/server/plugins/mail.ts': { isExternal: false, importedIds: ['/app/server/utils/certificate-pdf.ts'] },
}
const api = { getModuleInfo: (id: string) => graph[id] ?? null }

describe('addWorkerEntries', () => {
  it('adds the worker entries beside the server entry, keeping index.mjs as the server', () => {
    const config: { input?: unknown, output?: unknown } = { input: '/nitro/entry.mjs', output: {} }
    addWorkerEntries(config, '/app')
    expect(config.input).toEqual({ 'index': '/nitro/entry.mjs', 'workers/certificate-pdf': '/app/server/workers/certificate-pdf.ts', 'workers/bar-model': '/app/server/workers/bar-model.ts' })
    const names = (config.output as { entryFileNames: (c: { name: string }) => string }).entryFileNames
    expect(names({ name: 'index' })).toBe('index.mjs')
    expect(names({ name: 'workers/certificate-pdf' })).toBe('[name].mjs')
  })

  it('puts what a worker imports in its own chunk and leaves the rest to the server\'s chunking', () => {
    const config: { input?: unknown, output?: unknown } = { input: '/nitro/entry.mjs', output: { manualChunks: (id: string) => (id.includes('plugins') ? 'nitro' : undefined) } }
    addWorkerEntries(config, '/app')
    const chunks = (config.output as { manualChunks: (id: string, a: typeof api) => string | undefined }).manualChunks
    expect(chunks('/app/server/utils/certificate-pdf.ts', api)).toBe('worker-modules')
    expect(chunks('/app/shared/format/numbers.ts', api)).toBe('worker-modules')
    expect(chunks('/app/server/plugins/mail.ts', api)).toBe('nitro')
    expect(chunks('pdfmake', api)).toBeUndefined()
    // The entry itself stays an entry.
    expect(chunks('/app/server/workers/certificate-pdf.ts', api)).toBeUndefined()
  })

  it('leaves a configuration with several inputs alone', () => {
    const config = { input: { a: 'a.mjs' }, output: {} }
    addWorkerEntries(config, '/app')
    expect(config.input).toEqual({ a: 'a.mjs' })
  })
})
