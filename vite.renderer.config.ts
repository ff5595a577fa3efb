import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Plugin, UserConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { CONTENT_SECURITY_POLICY } from './src-main/csp.js';

/** Settings shared by the web build (vite.web.config.ts) and the Electron renderer (electron.vite.config.ts). */

export const projectRoot = path.dirname(fileURLToPath(import.meta.url));
export const rendererRoot = path.join(projectRoot, 'src-renderer');
const packageJson = JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version: string };

/** Adds the CSP as a meta tag to the built page (the Electron shell also sends it as a header). */
function contentSecurityPolicyMeta(): Plugin {
  // frame-ancestors is only honoured as a header (browsers warn when it comes in a meta tag).
  const metaPolicy = CONTENT_SECURITY_POLICY.split('; ').filter((d) => !d.startsWith('frame-ancestors')).join('; ');
  return {
    name: 'stress-ledger-csp-meta',
    apply: 'build',
    transformIndexHtml: () => [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: metaPolicy }, injectTo: 'head' }],
  };
}

export function rendererConfig(outDir: string): UserConfig {
  return {
    root: rendererRoot,
    base: './',
    publicDir: false,
    plugins: [react(), contentSecurityPolicyMeta()],
    define: { __APP_VERSION__: JSON.stringify(packageJson.version) },
    worker: { format: 'es' },
    build: {
      outDir,
      emptyOutDir: true,
      target: 'es2022',
      sourcemap: true,
      chunkSizeWarningLimit: 2500,
      // Demo files are fetched at run time: keep them as files, never inline data: URLs (CSP connect-src 'self').
      assetsInlineLimit: (file: string) => (file.includes(`${path.sep}demo${path.sep}`) || file.includes('/demo/') ? false : undefined),
      rollupOptions: { input: path.join(rendererRoot, 'index.html') },
    },
    server: { fs: { allow: [projectRoot] } },
  };
}
