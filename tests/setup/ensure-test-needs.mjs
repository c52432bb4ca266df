// `npm test` runs this first: it finds (or installs, where it may) what the tests need from the
// system, or stops at once with the exact command to run.
import { ensureTestNeeds, NEEDS, realSystem, SERVER_NEEDS } from './test-needs.mjs';

process.exit(ensureTestNeeds(realSystem(), [...NEEDS, ...SERVER_NEEDS]).ok ? 0 : 1);
