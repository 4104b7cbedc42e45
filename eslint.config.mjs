import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['drizzle/**', '.output/**', '.output-*/**', '.nuxt-*/**', '.data/**', 'test-results/**', 'playwright-report/**'] },
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      'vue/multi-word-component-names': 'off',
    },
  },
)
