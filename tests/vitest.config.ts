import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'e2e',
    include: ['e2e/**/*.test.ts', 'security/**/*.test.ts', 'reliability/**/*.test.ts'],
    environment: 'node',
    // `npm run test:soak` (FEMTOSLOT_SOAK=1) runs the reliability suite with larger counts.
    testTimeout: process.env.FEMTOSLOT_SOAK === '1' ? 600_000 : 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    sequence: { groupOrder: 2 },
  },
});
