import path from 'node:path';
import { defineConfig } from 'vite';
import { CONTENT_SECURITY_POLICY } from './src-main/csp.js';
import { projectRoot, rendererConfig, rendererRoot } from './vite.renderer.config.js';

const base = rendererConfig(path.join(projectRoot, 'dist-web'));

/**
 * The renderer as a plain web app in dist-web/ (web bridge), served on 127.0.0.1:5199.
 * The web build also holds bench/index.html, the archive seeding page of the in-browser
 * speed measurements (bench/app.bench.ts); the app links to it nowhere.
 */
export default defineConfig({
  ...base,
  build: {
    ...base.build,
    rollupOptions: { input: { main: path.join(rendererRoot, 'index.html'), bench: path.join(rendererRoot, 'bench', 'index.html') } },
  },
  server: { host: '127.0.0.1', port: 5199, strictPort: true, fs: { allow: [projectRoot] } },
  preview: {
    host: '127.0.0.1', port: 5199, strictPort: true,
    headers: { 'Content-Security-Policy': CONTENT_SECURITY_POLICY, 'X-Content-Type-Options': 'nosniff' },
  },
});
