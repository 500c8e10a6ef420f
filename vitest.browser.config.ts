import { defineConfig } from 'vitest/config'

// Browser tests: Debian's Chromium (/usr/bin/chromium, `apt-get install chromium`) driven by
// playwright-core against the Node server started in-process on 127.0.0.1. Screenshots go to artifacts/.
export default defineConfig({
  test: {
    include: ['test/browser/**/*.btest.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
})
