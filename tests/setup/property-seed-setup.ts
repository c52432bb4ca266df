// Vitest setup file: every fc.assert in the run starts from the run's one seed.
import fc from 'fast-check';
import { propertySeed } from './property-seed';

fc.configureGlobal({ ...fc.readConfigureGlobal(), seed: propertySeed() });
