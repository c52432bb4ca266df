// The builds list's row type, as `builds.list` returns it.
import type { ApiOutput } from '$service/handlers';

export type BuildSummary = ApiOutput<'builds.list'>[number];
