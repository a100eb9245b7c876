// ESLint flat config. The import-direction rules are the architecture written
// as code: app → features → components/hooks/lib → shared; server → shared;
// workers → shared; shared imports nothing of ours; features never import
// each other.
import fs from 'node:fs';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const features = fs.existsSync('src/features')
  ? fs.readdirSync('src/features', { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name)
  : [];

const zones = [
  { target: './shared', from: ['./src', './server', './tools', './e2e', './bench'], message: 'shared/ imports nothing of ours outside shared/.' },
  { target: './server', from: ['./src', './e2e'], message: 'The server depends only on shared/.' },
  { target: './src', from: ['./server', './tools'], message: 'The client never imports server or dev-tool code.' },
  { target: './src/workers', from: ['./src/app', './src/features', './src/components', './src/lib'], message: 'Workers depend only on shared/.' },
  { target: ['./src/components', './src/lib', './src/hooks'], from: ['./src/features', './src/app'], message: 'Shared client folders never import features or the app.' },
  { target: './src/features', from: './src/app', message: 'Features never import the app layer.' },
  ...features.map((name) => ({
    target: `./src/features/${name}`,
    from: './src/features',
    except: [`./${name}`],
    message: 'Features never import each other; compose them in src/app.',
  })),
];

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'test-results', 'playwright-report', 'coverage'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js}'],
    plugins: { 'import-x': importX, 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    settings: { 'import-x/resolver-next': [importX.createNodeResolver({ extensions: ['.ts', '.tsx', '.js'] })] },
    rules: {
      'import-x/no-restricted-paths': ['error', { zones }],
      'import-x/no-cycle': 'off',
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
);
