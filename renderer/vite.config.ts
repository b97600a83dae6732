// Builds the Svelte renderer into build/renderer. `base: './'` keeps asset URLs
// relative so the same build loads from file:// in Electron and from the
// browser-mode host over HTTP.
import { defineConfig } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';
import { fileURLToPath } from 'node:url';

const rendererRoot = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root: rendererRoot,
  base: './',
  plugins: [svelte()],
  build: {
    outDir: fileURLToPath(new URL('../build/renderer', import.meta.url)),
    emptyOutDir: true,
    target: 'es2023',
  },
});
