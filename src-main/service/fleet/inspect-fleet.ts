import type { FleetRecords } from './fleet-format';
import { FLEET_KINDS } from './fleet-format';
import { sortProblems, type FleetProblem } from './fleet-problems';
import { NO_STORED_IDS, referenceProblems, type StoredIds } from './fleet-references';
import type { OnProgress } from './progress';
import { validateFleet } from './validate-fleet';
import { logReferenceProblems, type FleetLogs } from './fleet-logs';

export type FleetInspection = { ok: true; fleet: FleetRecords; logs: FleetLogs } | { ok: false; problems: FleetProblem[] };

/**
 * The whole check of a fleet value: its shape, every record against the service's schemas,
 * duplicate ids, and every reference (to the file, plus the store's records when merging).
 * Pure; the command line's `check` uses it with no store at all.
 */
export function inspectFleet(input: unknown, stored: StoredIds = NO_STORED_IDS, onProgress?: OnProgress): FleetInspection {
  const validation = validateFleet(input, onProgress);
  const problems = [...validation.problems];
  if (validation.envelopeOk) {
    problems.push(...referenceProblems(validation.fleet, validation.fileIds, stored, validation.buildPlaces));
    const fileSupplies = new Map(validation.fleet.builds.flatMap((b) => b.supplies.map((s) => [s.id, b.id] as const)));
    problems.push(...logReferenceProblems(validation.logs, { batteries: validation.fileIds.batteries, builds: validation.fileIds.builds, supplyOwners: fileSupplies }, null));
  }
  if (problems.length > 0) return { ok: false, problems: sortProblems(problems, FLEET_KINDS) };
  return { ok: true, fleet: validation.fleet, logs: validation.logs };
}
