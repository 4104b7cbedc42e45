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
    // The house style on top of @nuxt/eslint's stylistic rules (nuxt.config.ts): lines of at most 140 characters,
    // compact templates and one-line `try { … }` / `interface X { a: string; b: number }` where they read well.
    name: 'brinkwater/style',
    rules: {
      '@stylistic/max-len': ['error', { code: 140, ignoreUrls: true, ignoreRegExpLiterals: true, ignoreStrings: true, ignoreTemplateLiterals: true }],
      '@stylistic/arrow-parens': ['error', 'as-needed', { requireForBlockBody: true }],
      '@stylistic/member-delimiter-style': ['error', {
        multiline: { delimiter: 'none' }, singleline: { delimiter: 'semi', requireLast: false },
      }],
      '@stylistic/max-statements-per-line': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
    },
  },
  {
    // In templates long class lists and text read better whole: the line limit counts the markup only.
    name: 'brinkwater/style-vue',
    files: ['**/*.vue'],
    rules: {
      '@stylistic/max-len': 'off',
      'vue/max-len': ['error', {
        code: 140, ignoreUrls: true, ignoreStrings: true, ignoreTemplateLiterals: true, ignoreRegExpLiterals: true,
        ignoreHTMLAttributeValues: true, ignoreHTMLTextContents: true,
      }],
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
