// Unit and property tests for core/, electron/ handlers and the CLI. Playwright specs
// (test/browser/*.spec.ts) are deliberately not included: they run under Playwright.
// The Svelte plugin compiles the renderer's rune modules (*.svelte.ts), so the state
// they hold can be tested here as plain objects.
import { defineConfig } from 'vitest/config';
import { svelte } from '@sveltejs/vite-plugin-svelte';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  root,
  plugins: [svelte({ configFile: false })],
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/browser/**', 'node_modules/**'],
    environment: 'node',
    testTimeout: 60_000,
    reporters: ['default', ['junit', { suiteName: 'stemline-unit' }]],
    outputFile: { junit: 'test-results/unit-junit.xml' },
  },
});
