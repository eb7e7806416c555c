import nextCoreWebVitals from 'eslint-config-next/core-web-vitals';
import nextTypescript from 'eslint-config-next/typescript';

const knexOnlyInDataLayer = {
  paths: [
    { name: 'knex', message: 'Only db/ and lib/**/repo*.ts touch Knex (see DEVELOPERS.md).' },
    { name: 'mysql2', message: 'Only db/ touches the driver.' },
  ],
  patterns: [{ group: ['@aws-sdk/*'], message: 'Only lib/storage/ imports the AWS SDK.' }],
};

export default [
  { ignores: ['.next/**', 'node_modules/**', '.data/**', '.test-data/**', 'next-env.d.ts', 'coverage/**'] },
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    files: ['app/**', 'components/**', 'lib/**'],
    ignores: ['lib/**/repo*.ts', 'lib/storage/**', 'lib/db.ts'],
    rules: { 'no-restricted-imports': ['error', knexOnlyInDataLayer] },
  },
  {
    files: ['lib/transport/**', 'lib/access/**'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [{ group: ['next', 'next/*', 'react', 'react-dom', 'knex', '@/db/*', '@/lib/db', 'server-only'], message: 'lib/transport and lib/access are pure: no DB, Next or React.' }],
      }],
    },
  },
];
