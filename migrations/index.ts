/**
 * The ordered list of migrations. A static list (not a folder glob) so the same code runs
 * under tsx, vitest and a bundled server. Add a new migration file and append it here.
 */
import type { QueryInterface } from 'sequelize';
import * as initialSchema from './20261201-0001-initial-schema';

export interface MigrationModule {
  up(params: { context: QueryInterface }): Promise<void>;
  down(params: { context: QueryInterface }): Promise<void>;
}

export const MIGRATIONS: ReadonlyArray<{ name: string; module: MigrationModule }> = [
  { name: '20261201-0001-initial-schema', module: initialSchema },
];
