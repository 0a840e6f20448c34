import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

// The app's own alias for the project root, so unit tests can import app/utils as Nuxt does.
const root = fileURLToPath(new URL('.', import.meta.url))

export default defineConfig({
  test: {
    projects: [
      { resolve: { alias: { '~~': root } }, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      { test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', fileParallelism: false, testTimeout: 30000, hookTimeout: 60000 } },
      { test: { name: 'browser', include: ['tests/browser/**/*.test.ts'], environment: 'node', fileParallelism: false, testTimeout: 60000, hookTimeout: 120000 } }
    ]
  }
})
