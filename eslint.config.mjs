import { fileURLToPath } from 'node:url'
import { createNodeResolver } from 'eslint-plugin-import-x'
import withNuxt from './.nuxt/eslint.config.mjs'

const root = fileURLToPath(new URL('.', import.meta.url))

export default withNuxt(
  { ignores: ['drizzle/**', '.output/**', '.output-*/**', '.nuxt-*/**', '.data/**', 'test-results/**', 'playwright-report/**'] },
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      'vue/multi-word-component-names': 'off',
    },
  },
  {
    // No import circle between the files of the server and the shared code (explicit imports, aliases resolved).
    name: 'brinkwater/no-import-cycle',
    files: ['server/**/*.ts', 'shared/**/*.ts'],
    settings: {
      'import-x/extensions': ['.ts', '.mjs', '.js'],
      'import-x/resolver-next': [createNodeResolver({
        extensions: ['.ts', '.mjs', '.js', '.json'],
        alias: { '#shared': [`${root}shared`], '~~': [root.replace(/\/$/, '')] },
      })],
    },
    rules: { 'import/no-cycle': ['error', { ignoreExternal: true }] },
  },
)
