import { fileURLToPath } from 'node:url';
import path from 'node:path';

/** The repository root, so that data, migrations and the built client resolve from any cwd. */
export const repoRoot = path.resolve(fileURLToPath(new URL('..', import.meta.url)));

export const migrationsDir = path.join(repoRoot, 'migrations');
export const seedsDir = path.join(repoRoot, 'seeds');
export const fontsDir = path.join(repoRoot, 'fonts');
export const publicDir = path.join(repoRoot, 'public');
