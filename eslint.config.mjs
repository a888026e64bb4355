// @ts-check
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['drizzle/**', 'tests/fixtures/**', '.data/**', 'test-results/**'] },
  {
    // Tests read loosely typed JSON replies.
    files: ['tests/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
)
