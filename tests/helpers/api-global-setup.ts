import type { TestProject } from 'vitest/node';
import { startTestDatabase } from './test-database';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    /** The owner account (migrations, DDL) of the same database. */
    databaseOwnerUrl: string;
    databaseSocket: string;
    databaseDir: string;
  }
}

export default async function setup(project: TestProject) {
  const database = await startTestDatabase('api');
  project.provide('databaseUrl', database.instance.url);
  project.provide('databaseOwnerUrl', database.instance.ownerUrl);
  project.provide('databaseSocket', database.instance.socket);
  project.provide('databaseDir', database.dir);
  return async () => {
    await database.stop();
  };
}
