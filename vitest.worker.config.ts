import { defineConfig } from 'vitest/config'

// Tests that run the bundled worker in workerd (wrangler's local runtime, offline) and compare with Node.
export default defineConfig({
  test: {
    include: ['test/worker/**/*.wtest.ts'],
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
})
