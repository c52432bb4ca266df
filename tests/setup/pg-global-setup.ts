import type { TestProject } from 'vitest/node';
import { startPgCluster } from '../helpers/pg-cluster';

// One throwaway PostgreSQL cluster for the whole run: each test that needs a store creates a
// schema of its own in it (tests/helpers/store-engines.ts). Stopped and removed after the run,
// also when tests fail. When no server can be started, the PostgreSQL half of the matrix is
// skipped and every skipped suite's name says why.

declare module 'vitest' {
  export interface ProvidedContext {
    /** The cluster's maintenance database, or null with the reason it could not be started. */
    rigbookPg: { adminUrl: string | null; reason: string };
  }
}

export default function setup(project: TestProject): () => void {
  if (process.env.RIGBOOK_SKIP_PG === '1') {
    project.provide('rigbookPg', { adminUrl: null, reason: 'RIGBOOK_SKIP_PG=1 is set' });
    return () => {};
  }
  const started = startPgCluster();
  if (!started.ok) {
    process.stderr.write(`\nPostgreSQL tests are SKIPPED: ${started.reason}\n\n`);
    project.provide('rigbookPg', { adminUrl: null, reason: started.reason });
    return () => {};
  }
  project.provide('rigbookPg', { adminUrl: started.cluster.urlFor('postgres'), reason: '' });
  const stop = () => started.cluster.stop();
  // A run stopped with Ctrl-C still removes the cluster.
  process.once('exit', stop);
  return stop;
}
