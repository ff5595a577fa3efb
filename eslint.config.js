// Lint rules, including the layer rules of DEVELOPERS.md: the engine imports nothing
// from the DOM, Electron, Dexie, React or ECharts; the archive imports no React or
// ECharts; nothing in the renderer imports Electron or Node built-ins.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';

const uiLibraries = ['react', 'react-dom', 'react-dom/*', 'echarts', 'echarts/*'];
const nodeBuiltins = ['node:*', 'fs', 'fs/*', 'path', 'os', 'child_process', 'crypto', 'stream', 'worker_threads'];

export default tseslint.config(
  { ignores: ['out/**', 'dist/**', 'dist-web/**', 'node_modules/**', 'e2e-output/**', 'bench-output/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'off',
    },
  },
  {
    files: ['src-renderer/engine/**/*.ts'],
    ignores: ['src-renderer/engine/cli/**'],
    languageOptions: { globals: { ...globals['shared-node-browser'] } },
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['electron', 'electron/*'], message: 'The engine is pure: no Electron.' },
          { group: ['dexie', 'dexie/*'], message: 'The engine is pure: no Dexie.' },
          { group: uiLibraries, message: 'The engine is pure: no React or ECharts.' },
          { group: nodeBuiltins, message: 'The engine runs in a Web Worker too: no Node built-ins.' },
          { group: ['**/app/**', '**/archive/**', '**/src-main/**'], message: 'The engine imports only engine modules.' },
        ],
      }],
      'no-restricted-globals': ['error', 'document', 'window', 'navigator', 'localStorage', 'indexedDB'],
    },
  },
  {
    files: ['src-renderer/engine/cli/**/*.ts'],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['electron', 'dexie', ...uiLibraries], message: 'The command line wraps the engine only.' },
          { group: ['**/app/**', '**/archive/**'], message: 'The command line wraps the engine only.' },
        ],
      }],
    },
  },
  {
    files: ['src-renderer/archive/**/*.ts'],
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['electron', ...uiLibraries, ...nodeBuiltins], message: 'The archive layer sits below the app: no React, ECharts, Electron or Node.' },
          { group: ['**/app/**', '**/src-main/**'], message: 'The archive imports only the engine and itself.' },
        ],
      }],
    },
  },
  {
    files: ['src-renderer/app/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'react-hooks/set-state-in-effect': 'off',
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['electron', ...nodeBuiltins], message: 'The renderer reaches the system only through the bridge.' },
          { group: ['**/src-main/**'], message: 'The renderer reaches the main process only through the bridge.' },
        ],
      }],
    },
  },
  {
    files: ['src-main/**/*.ts', 'test/**/*.{ts,tsx}', 'e2e/**/*.ts', 'bench/**/*.ts', 'scripts/**/*.{js,mjs,ts}', '*.config.{js,ts}'],
    languageOptions: { globals: { ...globals.node } },
  },
);
