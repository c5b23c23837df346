import { readdirSync } from 'node:fs';
import { URL } from 'node:url';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import { importX } from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';

/**
 * Layer rules (DEVELOPERS.md, "Layers"). Paths are resolved, so a relative
 * import and an alias (`@/`, `@shared/`) are judged alike.
 *
 * - shared/engine imports only shared/engine and the pure packages below.
 * - shared/* never imports the client or the server; shared/schemas may import
 *   the engine, never the other way round.
 * - src/features/<a> imports another feature only through its index.ts.
 * - src/components, src/lib and src/api never import features, pages or the app.
 * - server/routes never imports server/models (routes call services).
 * - src never imports server, server never imports src.
 */
export const ENGINE_PACKAGES = ['zod'];

const features = readdirSync(new URL('./src/features', import.meta.url), {
  withFileTypes: true,
})
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

const featureZones = features.flatMap((feature) =>
  features
    .filter((other) => other !== feature)
    .map((other) => ({
      target: `./src/features/${feature}`,
      from: `./src/features/${other}`,
      except: ['./index.ts'],
      message: `Import the "${other}" feature through its public index (@/features/${other}).`,
    })),
);

const layerZones = [
  {
    target: './shared/engine',
    from: [
      './shared/schemas',
      './shared/chemistry',
      './src',
      './server',
      './tests',
      './seeders',
      './migrations',
    ],
    message: 'The engine is pure: it imports only shared/engine and its declared packages.',
  },
  {
    target: './shared',
    from: ['./src', './server', './seeders', './migrations'],
    message: 'shared/ is imported by the client and the server, never the other way round.',
  },
  {
    target: './server/routes',
    from: './server/models',
    message: 'HTTP routes call services and policies; models are the services’ business.',
  },
  {
    target: './src',
    from: ['./server', './seeders', './migrations'],
    message: 'The client never imports server code; share it through shared/.',
  },
  {
    target: './server',
    from: './src',
    message: 'The server never imports client code; share it through shared/.',
  },
  {
    target: ['./src/components', './src/lib', './src/api'],
    from: ['./src/features', './src/routes', './src/app'],
    message:
      'Shared client pieces sit below features, pages and the app: they may not import them.',
  },
];

/**
 * Query keys and URLs have one source each (DEVELOPERS.md, "How to add a query"
 * and "How to add a URL"): a key is built by src/api/query-keys.ts, an API
 * address by src/paths.ts. Anywhere else in src an array literal used as a
 * query key, or a string that starts with /api/, is refused.
 */
const QUERY_KEY_MESSAGE =
  'Build query keys with queryKeys from @/api/query-keys, never as an array literal.';
const queryKeySyntax = [
  { selector: "Property[key.name='queryKey'] > ArrayExpression", message: QUERY_KEY_MESSAGE },
  {
    selector: "Property[key.name='queryKey'] > TSAsExpression > ArrayExpression",
    message: QUERY_KEY_MESSAGE,
  },
  {
    selector:
      'CallExpression[callee.property.name=/^(get|set)Quer(y|ies)(Data|State)$/] > ArrayExpression',
    message: QUERY_KEY_MESSAGE,
  },
  {
    selector: "MemberExpression[object.property.name='queryKey'][computed=true]",
    message: 'Match queries with the keys of @/api/query-keys, not by reading a key’s parts.',
  },
];
const URL_MESSAGE = 'API addresses live in src/paths.ts (api.*); use them from there.';
const urlSyntax = [
  { selector: 'Literal[value=/^\\/api\\//]', message: URL_MESSAGE },
  { selector: 'TemplateElement[value.raw=/^\\/api\\//]', message: URL_MESSAGE },
];

/**
 * Numbers a chemist reads have one formatter (DEVELOPERS.md, "Numbers"): src/lib/format.ts
 * (formatSignificant, formatEngineering, formatFactor; significant() for files written for other
 * programs). toExponential gives "1.2e-7" and toPrecision switches to it on its own, so both are
 * refused anywhere else in src.
 */
const NUMBER_MESSAGE =
  'Show numbers with formatSignificant/formatEngineering from @/lib/format (significant() for exports), not toExponential/toPrecision.';
const numberSyntax = [
  {
    selector: 'CallExpression[callee.property.name=/^(toExponential|toPrecision)$/]',
    message: NUMBER_MESSAGE,
  },
];

/**
 * No markup is injected into the page (DEVELOPERS.md, "Markup"): React builds
 * every element, and a structure drawing is shown as an <img> data URL
 * (src/features/compounds/components/structure-image.tsx), where SVG runs
 * nothing. dangerouslySetInnerHTML, innerHTML/outerHTML and insertAdjacentHTML
 * are refused everywhere.
 */
const MARKUP_MESSAGE =
  'Do not inject markup: render with React, or show an SVG as an <img> data URL (StructureImage).';
const markupSyntax = [
  { selector: "JSXAttribute[name.name='dangerouslySetInnerHTML']", message: MARKUP_MESSAGE },
  { selector: "Property[key.name='dangerouslySetInnerHTML']", message: MARKUP_MESSAGE },
  {
    selector: 'AssignmentExpression > MemberExpression.left[property.name=/^(inner|outer)HTML$/]',
    message: MARKUP_MESSAGE,
  },
  {
    selector: "CallExpression[callee.property.name='insertAdjacentHTML']",
    message: MARKUP_MESSAGE,
  },
];

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'dist-server/**',
      'node_modules/**',
      '.data/**',
      'test-output/**',
      'coverage/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
    },
  },
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json' })],
    },
    rules: {
      'import-x/no-restricted-paths': ['error', { zones: [...layerZones, ...featureZones] }],
      'import-x/no-duplicates': 'error',
    },
  },
  {
    // The engine stays pure: no I/O, no database, no DOM, no package but its own.
    files: ['shared/engine/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: `^(?!\\.|(${ENGINE_PACKAGES.join('|')})(/|$))`,
              message: `The engine imports only shared/engine and ${ENGINE_PACKAGES.join(', ')}.`,
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'fetch', 'localStorage'],
    },
  },
  {
    files: ['**/*.{js,mjs,ts,tsx}'],
    rules: { 'no-restricted-syntax': ['error', ...markupSyntax] },
  },
  {
    // A later no-restricted-syntax replaces an earlier one: each list repeats markupSyntax.
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/api/query-keys.ts', 'src/paths.ts', 'src/lib/format.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        ...markupSyntax,
        ...queryKeySyntax,
        ...urlSyntax,
        ...numberSyntax,
      ],
    },
  },
  {
    files: ['src/api/query-keys.ts'],
    rules: { 'no-restricted-syntax': ['error', ...markupSyntax, ...urlSyntax, ...numberSyntax] },
  },
  {
    files: ['src/paths.ts'],
    rules: {
      'no-restricted-syntax': ['error', ...markupSyntax, ...queryKeySyntax, ...numberSyntax],
    },
  },
  {
    // The one number formatter.
    files: ['src/lib/format.ts'],
    rules: {
      'no-restricted-syntax': ['error', ...markupSyntax, ...queryKeySyntax, ...urlSyntax],
    },
  },
  {
    // Every payload string is storable text (no NUL, no lone surrogate): build it with text().
    files: ['shared/schemas/**/*.ts', 'shared/engine/document.ts', 'server/routes/**/*.ts'],
    ignores: ['shared/schemas/errors.ts'],
    rules: {
      'no-restricted-properties': [
        'error',
        {
          object: 'z',
          property: 'string',
          message: 'Use text() from @shared/schemas/text: it refuses NUL and broken Unicode.',
        },
      ],
    },
  },
);
