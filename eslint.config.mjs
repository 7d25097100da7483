// ESLint flat config. The layers of DEVELOPERS.md are rules here, so a change that breaks them
// fails `npm run lint` (and so `npm test`), not a review.
import nextPlugin from '@next/eslint-plugin-next';
import pluginQuery from '@tanstack/eslint-plugin-query';
import prettierConfig from 'eslint-config-prettier';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

/** Server-only modules: never imported by client code, pure code or shared components. */
const serverOnly = {
  regex: '^@/(lib/(db|services|api|mail|storage)(/.*)?|lib/auth(/(?!roles$).*)?|lib/env|db/.*)$',
  message:
    'Server-only module: client code, pure code and shared components must not import it (DEVELOPERS.md, layers).',
};

/** A local rule: a file that starts with 'use client' may not import a server-only module. */
const layersPlugin = {
  rules: {
    'client-imports': {
      meta: {
        type: 'problem',
        schema: [],
        messages: {
          server: "'{{source}}' is server-only; a 'use client' file cannot import it (DEVELOPERS.md, layers).",
        },
      },
      create(context) {
        const body = context.sourceCode.ast.body;
        const isClient = body.some((n) => n.type === 'ExpressionStatement' && n.directive === 'use client');
        if (!isClient) return {};
        const patterns = [
          /^@\/lib\/(db|services|api|mail|storage)(\/|$)/,
          /^@\/lib\/auth(\/(?!roles$).*)?$/,
          /^@\/lib\/env$/,
          /^@\/db\//,
          /^server-only$/,
          /^node:/,
        ];
        const check = (node) => {
          if (node.importKind === 'type') return;
          const source = node.source?.value;
          if (typeof source === 'string' && patterns.some((p) => p.test(source))) {
            context.report({ node, messageId: 'server', data: { source } });
          }
        };
        return { ImportDeclaration: check, ExportNamedDeclaration: check, ExportAllDeclaration: check };
      },
    },
  },
};

export default tseslint.config(
  {
    ignores: [
      'node_modules/**',
      '.next/**',
      '.data/**',
      'test-results/**',
      'playwright-report/**',
      'next-env.d.ts',
      'db/schema.ts',
    ],
  },
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    plugins: {
      '@next/next': nextPlugin,
      'react-hooks': reactHooks,
      layers: layersPlugin,
    },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs['core-web-vitals'].rules,
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      'layers/client-imports': 'error',
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'separate-type-imports' }],
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  ...pluginQuery.configs['flat/recommended'],
  {
    // Plain JavaScript (configs, the bootstrap, the local fakes): no type information needed.
    files: ['**/*.mjs', '**/*.js'],
    ...tseslint.configs.disableTypeChecked,
  },
  {
    // Pure, universal core: imports nothing of the app, nothing of Next, React or Node.
    files: ['lib/matcher/**/*.ts', 'lib/rules/**/*.ts', 'lib/walk/**/*.ts'],
    ignores: ['**/*.test.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            serverOnly,
            {
              regex:
                '^(@/(app|components|lib/(inspection|queries|http))(/.*)?|next(/.*)?|react(-dom)?(/.*)?|server-only|node:.*)$',
              message: 'lib/matcher, lib/rules and lib/walk are pure: no app, framework, React or Node imports.',
            },
          ],
        },
      ],
    },
  },
  {
    // Shared components and the device side never read the database or call services.
    files: ['components/**/*.{ts,tsx}', 'lib/inspection/**/*.ts', 'lib/queries/**/*.ts', 'lib/http/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [serverOnly] }],
    },
  },
  {
    // Tests and scripts may do what the code under test may not.
    files: ['**/*.test.ts', 'tests/**/*.ts', 'scripts/**/*.ts'],
    rules: {
      '@typescript-eslint/no-floating-promises': 'off',
      '@typescript-eslint/unbound-method': 'off',
    },
  },
  {
    // Test doubles implement async interfaces and answer at once; an `async` without `await` is their honest form.
    files: ['**/*.test.ts', 'tests/**/*.ts'],
    rules: { '@typescript-eslint/require-await': 'off' },
  },
  {
    // Migrations are append-only and typed `Kysely<any>` on purpose: each runs against the schema as it
    // was at its own point in history, which no generated type describes (db/schema.ts is today's).
    files: ['migrations/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  prettierConfig,
);
