import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: ['packages/shared', 'apps/api', 'tests', 'infra/local-fakes', 'apps/web'],
  },
});
