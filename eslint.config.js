// Flat config, kept small: typescript-eslint's recommended rules on the TypeScript we own, and a
// fence around the pure domain (style.md: lib/domain knows nothing of Astro, React, Sequelize,
// Lucia, the file system, the network or the server code).
import tseslint from 'typescript-eslint';

const FENCE_MESSAGE =
  'src/lib/domain and src/lib/schemas are the pure core: no framework, database, auth, file-system, network or server imports (style.md, Layout).';

export default tseslint.config(
  { ignores: ['dist/**', '.astro/**', 'node_modules/**', '.data/**', 'coverage/**', 'artifacts/**'] },
  {
    files: ['src/**/*.{ts,tsx}', 'db/**/*.ts', 'tests/**/*.{ts,tsx}', 'bench/**/*.ts'],
    extends: [tseslint.configs.recommended],
  },
  {
    // HTTP tests read JSON bodies whose shape is what is under test.
    files: ['tests/**/*.{ts,tsx}'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['src/lib/domain/**/*.ts', 'src/lib/schemas/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: [
                'astro', 'astro/*', 'astro:*', '@astrojs/*',
                'react', 'react/*', 'react-dom', 'react-dom/*', 'reactflow', 'reactflow/*', 'zustand', 'zustand/*',
                'sequelize', 'sequelize/*', 'mariadb', 'mariadb/*', 'umzug',
                'lucia', 'lucia/*', '@node-rs/*',
                'fs', 'fs/*', 'node:fs', 'node:fs/*', 'crypto', 'node:crypto',
                '@/lib/server', '@/lib/server/*', '@db', '@db/*', '@/pages/*', '@/components/*', '@/middleware', 'http', 'https', 'node:http', 'node:https', 'net', 'node:net',
              ],
              message: FENCE_MESSAGE,
            },
            { regex: '^(\\.\\.?/)+(.*/)?(server|db|pages|components|middleware)(/|$)', message: FENCE_MESSAGE },
          ],
        },
      ],
    },
  },
);
