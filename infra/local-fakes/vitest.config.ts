import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: { name: 'fakes', include: ['stripe/**/*.test.ts'], testTimeout: 20000, sequence: { groupOrder: 4 } },
});
