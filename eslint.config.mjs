// @nuxt/eslint's project-aware config, with Voltwright's few additions.
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['.data/**', '.output/**', 'tests/artifacts/**'] },
  { rules: { 'vue/multi-word-component-names': 'off' } },
  // Tests read JSON answers whose shape is what they assert.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } }
)
