import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { arrowProblem, arrowProblemsIn, importsIn, sourceFiles } from './import-arrows';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

describe('the arrows of the architecture', () => {
  it('every import in the source tree keeps to them', () => {
    expect(sourceFiles(ROOT).length).toBeGreaterThan(100);
    expect(arrowProblemsIn(ROOT)).toEqual([]);
  });

  // The reader and the rules themselves, on imports written for the purpose.
  const problem = (from: string, line: string) => importsIn(from, line).map(arrowProblem);

  it('the core imports nothing outside the core, and no Node module', () => {
    expect(problem('src-main/core/pack.ts', "import { x } from './units';")).toEqual([null]);
    expect(problem('src-main/core/pack.ts', "import { db } from '../store/db-handle';")).toEqual([expect.stringMatching(/core may not import store/)]);
    expect(problem('src-main/core/pack.ts', "import { readFileSync } from 'node:fs';")).toEqual([expect.stringMatching(/without Node/)]);
  });

  it('the store and the service never reach up into a shell or the page', () => {
    expect(problem('src-main/store/backup.ts', "import { x } from '../service/contract';")).toEqual([expect.stringMatching(/store may not import service/)]);
    expect(problem('src-main/service/dispatch.ts', "import { x } from '../local/main';")).toEqual([expect.stringMatching(/service may not import local/)]);
    expect(problem('src-main/service/handlers/demo-handlers.ts', "import { demoFleet } from '../../../demo-fixtures/demo-fleet';")).toEqual([expect.stringMatching(/service may not import demo-fixtures/)]);
  });

  it('a shell reaches another only through shell-common', () => {
    expect(problem('src-main/local/main.ts', "import { EXIT } from '../cli/exit-codes';")).toEqual([expect.stringMatching(/local may not import cli/)]);
    expect(problem('src-main/local/main.ts', "import { EXIT } from '../shell-common/exit-codes';")).toEqual([null]);
  });

  it('the page sees the core and the contract through the aliases, and the handler map as types only', () => {
    expect(problem('src-renderer/lib/a.ts', "import type { ApiOutput } from '$service/handlers';")).toEqual([null]);
    expect(problem('src-renderer/lib/a.ts', "import { handlers } from '$service/handlers';")).toEqual([expect.stringMatching(/only as `import type`/)]);
    expect(problem('src-renderer/lib/a.ts', "import { runWrite } from '$service/run-write';")).toEqual([expect.stringMatching(/only the service contract/)]);
    expect(problem('src-renderer/lib/a.ts', "import { x } from '../../src-main/core/units';")).toEqual([expect.stringMatching(/through \$core/)]);
    expect(problem('src-renderer/lib/a.ts', "import type { ApiError } from '../../src-main/service/contract';")).toEqual([expect.stringMatching(/through \$service/)]);
    expect(problem('src-renderer/lib/a.ts', "import { x } from '$core/units';")).toEqual([null]);
    expect(problem('src-renderer/views/A.svelte', '<script lang="ts">\n  import { x } from \'../../src-main/store/schema\';\n</script>\n<p>x</p>')).toEqual([expect.stringMatching(/renderer may not import store/)]);
    expect(problem('src-renderer/lib/a.ts', "const m = await import('$service/open-service-host');")).toEqual([expect.stringMatching(/only the service contract/)]);
  });
});
