import type { VehicleKind } from '$core/domain';
import { figureGroupsFor, type FigureDef } from '../figures/figure-groups';
import { STAGES, stageOfFigure, type Stage } from './path-stages';

export interface StageFigureGroup {
  id: Stage;
  title: string;
  figures: FigureDef[];
}

const isGround = (kind: VehicleKind | null) => kind === 'car' || kind === 'truck';

/** The title of a stage as the sheet names it for a vehicle kind. */
export function stageTitle(stage: Stage, kind: VehicleKind | null): string {
  switch (stage) {
    case 'supply':
      return 'Packs';
    case 'controller':
      return 'Speed controller (supply current)';
    case 'motor':
      return 'Motor';
    case 'drive':
      return kind === null ? 'Gearing or propeller' : isGround(kind) ? 'Gearing' : 'Propeller';
    case 'output':
      return kind === null ? 'Wheels or thrust' : isGround(kind) ? 'Wheels' : 'Thrust';
  }
}

/** Every figure the sheet lists for a vehicle kind, grouped by stage of the power path, each once. */
export function figuresByStage(kind: VehicleKind | null): StageFigureGroup[] {
  const seen = new Set<string>();
  const groups = new Map<Stage, FigureDef[]>(STAGES.map((s) => [s, []]));
  for (const g of figureGroupsFor(kind)) {
    for (const f of g.figures) {
      if (seen.has(f.key)) continue;
      seen.add(f.key);
      groups.get(stageOfFigure(f.key))!.push(f);
    }
  }
  return STAGES.map((id) => ({ id, title: stageTitle(id, kind), figures: groups.get(id) ?? [] })).filter((g) => g.figures.length > 0);
}
