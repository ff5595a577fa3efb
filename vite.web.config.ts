import path from 'node:path';
import { defineConfig } from 'vite';
import { CONTENT_SECURITY_POLICY } from './src-main/csp.js';
import { projectRoot, rendererConfig } from './vite.renderer.config.js';

/** The renderer as a plain web app in dist-web/ (web bridge), served on 127.0.0.1:5199. */
export default defineConfig({
  ...rendererConfig(path.join(projectRoot, 'dist-web')),
  server: { host: '127.0.0.1', port: 5199, strictPort: true, fs: { allow: [projectRoot] } },
  preview: {
    host: '127.0.0.1', port: 5199, strictPort: true,
    headers: { 'Content-Security-Policy': CONTENT_SECURITY_POLICY, 'X-Content-Type-Options': 'nosniff' },
  },
});
