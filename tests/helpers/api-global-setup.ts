import type { TestProject } from 'vitest/node';
import { startTestDatabase } from './test-database';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    databaseSocket: string;
    databaseDir: string;
  }
}

export default async function setup(project: TestProject) {
  const database = await startTestDatabase('api');
  project.provide('databaseUrl', database.instance.url);
  project.provide('databaseSocket', database.instance.socket);
  project.provide('databaseDir', database.dir);
  return async () => {
    await database.stop();
  };
}
