import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { readdirSync } from 'node:fs';
import { URL } from 'node:url';

// Each client feature is entered only through its index.ts: src/app, src/components, src/lib and the
// other features may import src/features/<name> (its index), never a file inside it. A new feature
// folder is covered as soon as it exists.
const featureZones = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map(({ name }) => ({
    target: ['./src/*', './src/!(features)/**', `./src/features/!(${name})/**`],
    from: `./src/features/${name}`,
    except: ['./index.ts'],
    message: `import the ${name} feature through its index.ts (src/features/${name})`,
  }));

// Each shared package (shared/board, sim, analysis, api) is entered only through its index.ts from the
// app's code (src, server, bench and the other shared packages); tests may reach inside to test a part.
const sharedZones = readdirSync(new URL('./shared', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map(({ name }) => ({
    target: ['./src/**', './server/**', './bench/**', `./shared/!(${name})/**`],
    from: `./shared/${name}`,
    except: ['./index.ts'],
    message: `import shared/${name} through its index.ts`,
  }));

// The architecture of STYLE.md, checked: shared/ is pure, src/ never imports server/,
// server/ never imports src/, only server/db touches Knex, migrations import no app code,
// a client feature is imported only through its index.ts.
export default tseslint.config(
  { ignores: ['dist/**', 'dist-cli/**', 'node_modules/**', 'test-results/**', 'playwright-report/**', 'data/**', '.tmp/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    plugins: { 'import-x': importX, 'react-hooks': reactHooks },
    settings: { 'import-x/resolver': { typescript: true, node: true } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'warn',
      'react-hooks/rules-of-hooks': 'error',
      'import-x/no-cycle': ['error', { maxDepth: 6 }],
      'import-x/no-restricted-paths': ['error', {
        zones: [
          { target: './shared', from: './src', message: 'shared/ is pure: no client code' },
          { target: './shared', from: './server', message: 'shared/ is pure: no server code' },
          { target: './src', from: './server', message: 'the client never imports the server' },
          { target: './server', from: './src', message: 'the server never imports the client' },
          { target: './migrations', from: ['./src', './server', './shared'], message: 'migrations import no app code' },
          // server: http → services → db; a board's live side (server/boards-live) gets its store injected
          { target: './server/http', from: './server/db', message: 'server/http never imports server/db: call a service' },
          { target: './server/services', from: './server/http', message: 'services never import server/http (errors are in server/lib/errors.ts)' },
          { target: './server/boards-live', from: './server/db', message: 'server/boards-live gets its BoardStore injected; it never imports server/db' },
          {
            target: ['./server/!(db)/**', './server/*.ts', './server/db/!(board-store).ts'],
            from: './server/db/board-updates.ts',
            message: 'only the board store (server/db/board-store.ts) touches the board_updates table',
          },
          ...featureZones,
          ...sharedZones,
        ],
      }],
      'no-restricted-imports': 'off',
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [
        { group: ['node:*', 'fs', 'path', 'http', 'crypto', 'knex', 'react', 'react-dom', 'express'], message: 'shared/ has no Node, React or database imports' },
      ] }],
    },
  },
  {
    files: ['server/**/*.ts'],
    ignores: ['server/db/**'],
    rules: {
      'no-restricted-imports': ['error', { paths: [{ name: 'knex', message: 'only server/db touches Knex' }] }],
    },
  },
);
