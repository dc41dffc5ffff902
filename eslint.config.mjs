import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const config = [
  ...nextVitals,
  ...nextTs,
  {
    rules: {
      // TanStack Table and Virtual return non-memoisable functions by design; the React
      // Compiler already skips those components, so the warning only adds noise.
      'react-hooks/incompatible-library': 'off',
      '@typescript-eslint/no-unused-vars': [
        'warn',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
    },
  },
  {
    ignores: [
      '.next/**',
      '.next-*/**',
      'node_modules/**',
      'data/**',
      'next-env.d.ts',
      'coverage/**',
    ],
  },
];

export default config;
