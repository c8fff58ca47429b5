import tseslint from 'typescript-eslint';

/** Engine rooms, lowest first; each may import only the rooms before it. */
const ROOMS = ['base', 'numeric', 'material', 'answers', 'fit', 'input'];
const PURE = [
  { group: ['**/functions/**', '**/addin/**', '**/cli/**'], message: 'src/ must not import the outer layers' },
  { group: ['node:*', 'fs', 'path', 'os', 'child_process', 'office-js', '@microsoft/*'], message: 'src/ is pure TypeScript' },
];
/** Import patterns forbidden to the room at index i: every room above it, and the barrel src/index.ts. */
function above(i) {
  return [
    ...ROOMS.slice(i + 1).map((r) => ({
      group: [`**/${r}/**`, `../${r}/*`],
      message: `this room sits below src/${r}/; imports flow one way`,
    })),
    { group: ['../index.js', '../../index.js'], message: 'rooms import each other directly, never through the barrel src/index.ts' },
  ];
}

export default tseslint.config(
  { ignores: ['dist/**', 'deploy/**', 'node_modules/**', 'demo/**', 'coverage/**', 'test-output/**'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-console': 'off',
      'no-eval': 'error',
      'no-new-func': 'error',
    },
  },
  // The engine is pure: no Office, DOM-only or Node-only modules, and nothing from the outer layers. Inside
  // it, rooms import only rooms below them: base <- numeric <- material <- answers <- fit <- input (docs/architecture.md).
  ...ROOMS.map((room, i) => ({
    files: [`src/${room}/**/*.ts`],
    rules: {
      'no-restricted-imports': ['error', { patterns: [...PURE, ...above(i)] }],
      'no-restricted-globals': ['error', 'Office', 'Excel', 'document', 'window', 'process'],
    },
  })),
  {
    files: ['src/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: PURE }],
      'no-restricted-globals': ['error', 'Office', 'Excel', 'document', 'window', 'process'],
    },
  },
  {
    // The command line reads the engine only; the worksheet functions and the pane are not its business.
    files: ['cli/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/functions/**', '**/addin/**'], message: 'cli/ imports only src/' }] }],
    },
  },
  // The pane (addin/README.md): the sheet port and its adapters know nothing of the page; the shell knows no job;
  // what a job computes and writes (plan, request, notes) runs without a page, so Node tests can check it.
  {
    files: ['addin/sheet/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/shell/**', '**/jobs/**', '**/preview/**'], message: 'addin/sheet/ sits below the page' }] },
      ],
      'no-restricted-globals': ['error', 'document', 'window'],
    },
  },
  {
    files: ['addin/shell/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/jobs/**', '**/preview/**'], message: 'the shell knows no job' }] }],
    },
  },
  {
    files: ['addin/jobs/*/plan.ts', 'addin/jobs/*/request.ts', 'addin/jobs/notes.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/pane.js', '**/shell/dom.js', '**/shell/shell.js', '**/shell/messages.js', '**/shell/ask.js', '**/shell/tabs.js'],
              message: 'a job plan runs without a page',
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'document', 'window'],
    },
  },
);
