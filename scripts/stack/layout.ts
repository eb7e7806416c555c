// Where the runners keep their state: one data directory per profile, inside the project.
import path from 'node:path';

export type Profile = 'dev' | 'test';

export const projectRoot = path.resolve(import.meta.dirname, '..', '..');

export const DATA_DIR_NAME: Record<Profile, string> = { dev: '.data', test: '.test-data' };

export type DataLayout = {
  dir: string;
  logs: string;
  run: string;
  mariadb: string;
  s3: string;
  mail: string;
  doi: string;
  reports: string;
  secrets: string;
};

export function dataLayout(dir: string): DataLayout {
  return {
    dir,
    logs: path.join(dir, 'logs'),
    run: path.join(dir, 'run'),
    mariadb: path.join(dir, 'mariadb'),
    s3: path.join(dir, 's3'),
    mail: path.join(dir, 'mail'),
    doi: path.join(dir, 'doi'),
    reports: path.join(dir, 'reports'),
    secrets: path.join(dir, 'secrets.json'),
  };
}

export function profileLayout(profile: Profile): DataLayout {
  return dataLayout(path.join(projectRoot, DATA_DIR_NAME[profile]));
}

/** Path relative to the project root, for messages. */
export function rel(file: string): string {
  const r = path.relative(projectRoot, file);
  return r.startsWith('..') ? file : r || '.';
}
