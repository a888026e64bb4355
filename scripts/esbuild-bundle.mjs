// The esbuild options every Node bundle of the engine shares (the analysis worker, the
// command-line scripts). Plain JavaScript: scripts/run-built.mjs loads it without a TypeScript loader.

/** audio-decode names decoders for formats we never install (ape…); leave those out of the bundle. */
const optionalDecoders = {
  name: 'optional-decoders',
  /** @param {import('esbuild').PluginBuild} b */
  setup(b) {
    b.onResolve({ filter: /^@audio\/decode-/ }, async (args) => {
      if (args.pluginData === 'retry') return undefined
      const found = await b.resolve(args.path, { kind: args.kind, resolveDir: args.resolveDir, pluginData: 'retry' })
      return found.errors.length > 0 ? { path: args.path, external: true } : found
    })
  },
}

/**
 * ESM for Node 20, split so decoders stay in lazily loaded chunks beside the entry.
 * @type {import('esbuild').BuildOptions}
 */
export const nodeBundleOptions = {
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
}
