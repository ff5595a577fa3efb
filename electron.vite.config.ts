import path from 'node:path';
import { defineConfig } from 'electron-vite';
import { projectRoot, rendererConfig } from './vite.renderer.config.js';

/**
 * Electron build: main process (ESM), preload (CommonJS, as sandboxed preloads require),
 * and the renderer served from app://stress-ledger/ out of out/renderer.
 */
export default defineConfig({
  main: {
    build: {
      outDir: path.join(projectRoot, 'out/main'),
      externalizeDeps: true,
      rollupOptions: { input: { index: path.join(projectRoot, 'src-main/index.ts') } },
    },
  },
  preload: {
    build: {
      outDir: path.join(projectRoot, 'out/preload'),
      externalizeDeps: true,
      rollupOptions: {
        input: { index: path.join(projectRoot, 'src-main/preload.ts') },
        output: { format: 'cjs', entryFileNames: '[name].cjs' },
      },
    },
  },
  renderer: rendererConfig(path.join(projectRoot, 'out/renderer')),
});
